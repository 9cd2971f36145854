import { forbidden } from '../http-error';

/** The signed-in person's organisation, for what is kept per supplier; refused for an account with none. */
export function organizationOf(user: Express.User): string {
  if (!user.organizationId) throw forbidden('your account belongs to no organisation');
  return user.organizationId;
}
