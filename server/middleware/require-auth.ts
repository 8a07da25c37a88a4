import type { RequestHandler } from 'express';
import { hasRole, type Role } from '../../shared/auth/roles';
import { AppError } from '../errors';

export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new AppError('unauthenticated', 'Sign in first'));
  next();
};

/** 401 when signed out, 403 when the role is below `role`. */
export const requireRole =
  (role: Role): RequestHandler =>
  (req, _res, next) => {
    if (!req.user) return next(new AppError('unauthenticated', 'Sign in first'));
    if (!hasRole(req.user, role)) return next(new AppError('forbidden', `Only ${role}s may do this`));
    next();
  };
