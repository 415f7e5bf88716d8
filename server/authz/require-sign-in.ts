import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error';

/** 401 for anonymous callers; what a signed-in user may do is the ability's business (403). */
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new AppError('sign_in_required', 401, 'Sign in to continue'));
  next();
};
