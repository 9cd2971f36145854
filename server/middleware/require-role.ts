import type { NextFunction, Request, Response } from 'express';
import type { Role } from '../../db/contracts';
import { forbidden, unauthorized } from '../http-error';

export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) return next(forbidden(`only a ${roles.join(' or ')} may do this`));
    next();
  };
}
