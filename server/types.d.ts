import type { SessionUser } from '../db/contracts';

declare global {
  namespace Express {
    // The signed-in user that passport-jwt puts on req.user: an interface, as declaration merging needs one.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}
export {};
