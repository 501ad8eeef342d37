import { Router, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { loginRequestSchema, registerRequestSchema } from '../../shared/schemas/auth';
import type { Config } from '../config';
import { AppError } from '../errors';
import { requireAuth, SESSION_COOKIE } from '../middleware/auth';
import { validateBody } from '../middleware/validate';
import type { UserModel } from '../models/user';
import type { AuthService } from '../services/auth-service';
import type { TokenService } from '../services/token-service';

export interface AuthRouterDeps {
  config: Config;
  auth: AuthService;
  tokens: TokenService;
}

export function authRouter({ config, auth, tokens }: AuthRouterDeps): Router {
  const router = Router();

  const cookieOptions = (req: Request) => ({
    httpOnly: true,
    sameSite: 'lax' as const,
    secure: config.cookieSecure ?? req.secure,
    path: '/',
  });

  const startSession = (req: Request, res: Response, user: UserModel) => {
    const token = tokens.sign({ sub: user.id, role: user.role });
    res.cookie(SESSION_COOKIE, token, { ...cookieOptions(req), maxAge: tokens.ttlMs });
  };

  // Failed sign-ins only count: a user who gets in is never slowed.
  const loginLimiter = rateLimit({
    windowMs: config.loginWindowMinutes * 60_000,
    limit: config.loginMaxFailures,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => {
      next(new AppError('rate_limited', `Too many failed sign-ins. Try again in ${config.loginWindowMinutes} minutes.`));
    },
  });

  router.post('/register', validateBody(registerRequestSchema), async (req, res) => {
    const user = await auth.register(req.body);
    startSession(req, res, user);
    res.status(201).json({ user: user.toPublic() });
  });

  router.post('/login', loginLimiter, validateBody(loginRequestSchema), async (req, res) => {
    const user = await auth.login(req.body);
    startSession(req, res, user);
    res.json({ user: user.toPublic() });
  });

  router.post('/logout', (req, res) => {
    res.clearCookie(SESSION_COOKIE, cookieOptions(req));
    res.status(204).end();
  });

  router.get('/me', requireAuth, (req, res) => {
    res.json({ user: req.user!.toPublic() });
  });

  return router;
}
