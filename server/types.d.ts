import type { SessionUser } from '../db/contracts';

declare global {
  namespace Express {
    // The signed-in user that passport-jwt puts on req.user.
    interface User extends SessionUser {}
  }
}
export {};
