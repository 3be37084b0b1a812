// Limits on the anonymous routes that cost something (a bcrypt hash, an e-mail):
// - sign-in: failures per client address and e-mail (10 per 15 minutes: one account from
//   one place), and failures per client address across every e-mail (30 per 15 minutes,
//   so rotating e-mails gains nothing); successful sign-ins do not count. Every hash also
//   waits its turn in one bounded queue (shared/db/password-hashing.ts).
// - password-reset requests: per client address (5 per hour, counted whether or not the
//   account exists, so the limit tells nobody who has one); the per-account limit (3 mails
//   per hour) is in the route, counted in the database, and answers 202 like any request.
// The client address is the socket's, or X-Forwarded-For's when `--trust-proxy` says so.
import type { Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { errorBody } from './errors.js';

export interface LoginLimit {
  windowMs: number;
  /** Failed sign-ins per client address and e-mail in the window. */
  limit: number;
  /** Failed sign-ins per client address over all e-mails in the window. */
  perIp?: number;
}

export const DEFAULT_LOGIN_LIMIT: Required<LoginLimit> = { windowMs: 15 * 60 * 1000, limit: 10, perIp: 30 };

export interface ResetLimit {
  windowMs: number;
  /** Reset requests per client address in the window. */
  perIp: number;
  /** Reset mails per account in the window (more requests are answered alike, and send nothing). */
  perAccount: number;
}

export const DEFAULT_RESET_LIMIT: ResetLimit = { windowMs: 60 * 60 * 1000, perIp: 5, perAccount: 3 };

const clientKey = (req: Request) => ipKeyGenerator(req.ip ?? '');

function limiter(options: { windowMs: number; limit: number; skipSuccessfulRequests: boolean; key: (req: Request) => string; message: string }) {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    skipSuccessfulRequests: options.skipSuccessfulRequests,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: options.key,
    handler: (_req, res, _next, opts) => {
      res.status(opts.statusCode).json(errorBody(options.message));
    },
  });
}

/** Both sign-in limits, per address first: a request must pass each. */
export function loginRateLimit(options: LoginLimit = DEFAULT_LOGIN_LIMIT) {
  const perIp = limiter({
    windowMs: options.windowMs,
    limit: options.perIp ?? DEFAULT_LOGIN_LIMIT.perIp,
    skipSuccessfulRequests: true,
    key: clientKey,
    message: 'too many failed sign-in attempts from this address; try again later',
  });
  const perAccount = limiter({
    windowMs: options.windowMs,
    limit: options.limit,
    skipSuccessfulRequests: true,
    key: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return `${clientKey(req)}|${email}`;
    },
    message: 'too many failed sign-in attempts; try again later',
  });
  return [perIp, perAccount];
}

export function resetRequestRateLimit(options: ResetLimit = DEFAULT_RESET_LIMIT) {
  return limiter({
    windowMs: options.windowMs,
    limit: options.perIp,
    skipSuccessfulRequests: false,
    key: clientKey,
    message: 'too many password-reset requests from this address; try again later',
  });
}
