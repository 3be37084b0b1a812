// The Express app: JSON API under /api (every route in access.ts, checked by role), the
// built web app, and the background runs. Tests mount it with createApp(); index.ts listens.
// Order matters: security headers on every response; who the caller is and whether the
// route allows them is settled before any request body is read (a 50 MiB push body is
// parsed only for a researcher's token or session); then the body parsers and the routes.
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import { DEFAULT_SESSION_TTL_MS, deleteExpiredSessions } from '../shared/db/sessions.js';
import { DEFAULT_BCRYPT_COST } from '../shared/db/users.js';
import { DEFAULT_MAX_POINTS } from '../shared/study/index.js';
import { BackgroundRuns } from './background.js';
import type { AppContext, ServerOptions } from './context.js';
import { ExportSlots } from './export-slots.js';
import { HttpError } from './http-error.js';
import { Mailer } from './mail.js';
import { enforceAccess } from './middleware/access.js';
import { authenticate } from './middleware/auth.js';
import { handleErrors } from './middleware/errors.js';
import { DEFAULT_LOGIN_LIMIT, DEFAULT_RESET_LIMIT } from './middleware/rate-limit.js';
import { securityHeaders } from './middleware/security-headers.js';
import { MAX_PUSH_BYTES } from './push.js';
import { compareRouter } from './routes/compare.js';
import { healthRouter } from './routes/health.js';
import { invitesRouter } from './routes/invites.js';
import { parsePublicUrl } from './routes/links.js';
import { measurementsRouter } from './routes/measurements.js';
import { methodsRouter } from './routes/methods.js';
import { auditRouter, outboxRouter } from './routes/outbox.js';
import { passwordResetRouter } from './routes/password-reset.js';
import { pointsRouter } from './routes/points.js';
import { runsRouter } from './routes/runs.js';
import { sessionRouter } from './routes/session.js';
import { studiesRouter } from './routes/studies.js';
import { tokensRouter } from './routes/tokens.js';
import { usersRouter } from './routes/users.js';
import { defaultWebDir, webApp } from './static.js';

/** Uploads may expand to at most this many points (the CLI allows more). */
export const DEFAULT_UPLOAD_MAX_POINTS = Math.min(DEFAULT_MAX_POINTS, 1_000_000);
/** Expired sessions are deleted this often (and once at start-up). */
export const DEFAULT_SESSION_SWEEP_MS = 10 * 60 * 1000;

export type FilmsweepApp = Express & {
  context: AppContext;
  /** Stops the background runs (their batches in flight commit) and waits for their worker pools. */
  shutdown(): Promise<void>;
};

export function createApp(options: ServerOptions): FilmsweepApp {
  const log = options.log ?? ((e: unknown) => console.error('filmsweep serve:', e));
  const mailer = new Mailer(options.store);
  const resolved: AppContext['options'] = {
    // Only an explicit --dev shows the outbox (it holds live reset and invite links).
    dev: options.dev ?? false,
    bcryptCost: options.bcryptCost ?? DEFAULT_BCRYPT_COST,
    sessionTtlMs: options.sessionTtlMs ?? DEFAULT_SESSION_TTL_MS,
    maxPoints: options.maxPoints ?? DEFAULT_UPLOAD_MAX_POINTS,
    workers: options.workers ?? 2,
    maxConcurrentRuns: options.maxConcurrentRuns ?? 2,
    log,
    publicUrl: options.publicUrl === undefined ? undefined : parsePublicUrl(options.publicUrl),
    trustProxy: options.trustProxy,
    webDir: options.webDir === undefined ? defaultWebDir() : options.webDir,
    loginLimit: options.loginLimit ?? DEFAULT_LOGIN_LIMIT,
    resetLimit: options.resetLimit ?? DEFAULT_RESET_LIMIT,
    sessionSweepMs: options.sessionSweepMs ?? DEFAULT_SESSION_SWEEP_MS,
  };
  const background = new BackgroundRuns(options.store, mailer, { workers: resolved.workers, maxConcurrent: resolved.maxConcurrentRuns, publicUrl: resolved.publicUrl }, log);
  const ctx: AppContext = { store: options.store, options: resolved, mailer, background, exports: new ExportSlots() };

  // Expired sessions: deleted now and then on a timer (unref'd: it never keeps the process alive).
  const sweepSessions = () => deleteExpiredSessions(options.store).catch(log);
  const sessionSweep = sweepSessions();
  const sweepTimer = setInterval(sweepSessions, resolved.sessionSweepMs);
  sweepTimer.unref();

  const app = express();
  app.disable('x-powered-by');
  if (resolved.trustProxy !== undefined) app.set('trust proxy', resolved.trustProxy);
  app.use(securityHeaders());

  const api = express.Router();
  api.use(cookieParser());
  api.use(authenticate(ctx));
  api.use(enforceAccess(ctx));
  api.use('/runs/push', express.json({ limit: MAX_PUSH_BYTES }));
  api.use(express.json({ limit: '1mb' }));
  api.use('/health', healthRouter());
  api.use('/session', sessionRouter(ctx));
  api.use('/password-reset', passwordResetRouter(ctx));
  api.use('/invites', invitesRouter(ctx));
  api.use('/users', usersRouter(ctx));
  api.use('/tokens', tokensRouter(ctx));
  api.use('/methods', methodsRouter());
  const measurements = measurementsRouter(ctx);
  api.use('/studies/:id/measurements', measurements.byStudy);
  api.use('/studies', studiesRouter(ctx));
  api.use('/measurements', measurements.byId);
  api.use('/runs/:id/points', pointsRouter(ctx));
  api.use('/runs', runsRouter(ctx));
  api.use('/compare', compareRouter(ctx));
  api.use('/outbox', outboxRouter(ctx));
  api.use('/audit', auditRouter(ctx));
  // In the access table but not mounted would be a bug: say so rather than hang.
  api.use(() => {
    throw new HttpError(404, 'no such API route');
  });
  app.use('/api', api);

  const web = resolved.webDir ? webApp(resolved.webDir) : undefined;
  if (web) app.use(web);
  app.use((req, _res, next) => next(new HttpError(404, `nothing at ${req.path}${web ? '' : ' (the web app is not built: npm run build:web)'}`)));
  app.use(handleErrors(log));

  const shutdown = async () => {
    clearInterval(sweepTimer);
    await sessionSweep;
    await background.shutdown();
  };
  return Object.assign(app, { context: ctx, shutdown });
}
