import type { SessionUser } from '../db/contracts';

declare module 'node:http' {
  interface IncomingMessage {
    /** The request's id (server/middleware/request-log.ts), repeated in X-Request-Id and error bodies. */
    id?: string;
    /** A logger bound to the request's id, for a handler's own lines. */
    log?: import('pino').Logger;
  }
  interface ServerResponse {
    /** An unexpected error, logged with the request's line when the answer is finished. */
    err?: Error;
  }
}

declare global {
  namespace Express {
    // The signed-in user that passport-jwt puts on req.user: an interface, as declaration merging needs one.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}
export {};
