// Sign-in attempts: 10 failures per 15 minutes per client address and e-mail, then 429
// until the window passes. Successful sign-ins do not count.
import type { Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { errorBody } from './errors.js';

export interface LoginLimit {
  windowMs: number;
  limit: number;
}

export const DEFAULT_LOGIN_LIMIT: LoginLimit = { windowMs: 15 * 60 * 1000, limit: 10 };

export function loginRateLimit(options: LoginLimit = DEFAULT_LOGIN_LIMIT) {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req: Request) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
    },
    handler: (_req, res, _next, opts) => {
      res.status(opts.statusCode).json(errorBody('too many failed sign-in attempts; try again later'));
    },
  });
}
