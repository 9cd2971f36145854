import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';

/** Parses the body with a contract schema and writes the parsed value back (defaults, trimming, lower-casing). */
export function validateBody(schema: z.ZodType) {
  return (req: Request, _res: Response, next: NextFunction) => {
    req.body = schema.parse(req.body ?? {});
    next();
  };
}

/** Express 5's req.query is a getter, so the parsed query goes to res.locals.query. */
export function validateQuery(schema: z.ZodType) {
  return (req: Request, res: Response, next: NextFunction) => {
    res.locals.query = schema.parse(req.query);
    next();
  };
}
