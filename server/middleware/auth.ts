import type { RequestHandler } from 'express';
import type { Role } from '../../shared/schemas/auth';
import { AppError } from '../errors';
import type { TokenService } from '../services/token-service';
import type { UserService } from '../services/user-service';

export const SESSION_COOKIE = 'gnomon_session';

/** Sets req.user from the session cookie when it is valid and the account is active. */
export function authenticate(tokens: TokenService, users: UserService): RequestHandler {
  return async (req, _res, next) => {
    const claims = tokens.verify(req.cookies?.[SESSION_COOKIE] as string | undefined);
    if (claims) {
      const user = await users.findActive(claims.sub);
      if (user) req.user = user;
    }
    next();
  };
}

/** 401 unless signed in. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new AppError('unauthenticated', 'Sign in first');
  next();
};

/** 401 unless signed in, 403 unless the account has the role. */
export function requireRole(role: Role): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw new AppError('unauthenticated', 'Sign in first');
    if (req.user.role !== role) throw new AppError('forbidden', 'You do not have access to this');
    next();
  };
}
