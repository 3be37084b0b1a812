// Everything a route needs: the store, the settings, the mailer and the background runs.
import type { Store } from '../shared/db/store.js';
import type { BackgroundRuns } from './background.js';
import type { ExportSlots } from './export-slots.js';
import type { Mailer } from './mail.js';
import type { LoginLimit, ResetLimit } from './middleware/rate-limit.js';

export interface ServerOptions {
  store: Store;
  /** Development mode (`serve --dev`): leads may read the mail outbox at /api/outbox (every read audited). Default false. */
  dev?: boolean;
  /** bcrypt cost for new passwords (tests use 4). */
  bcryptCost?: number;
  sessionTtlMs?: number;
  /** Express `trust proxy` (set when behind an HTTPS proxy, so cookies get Secure). */
  trustProxy?: boolean | number | string;
  /** Folder of the built web app; null to serve the API only. Default: dist/web when present. */
  webDir?: string | null;
  /** Base of links in e-mails (http or https). Default: the address the server listens on, never a request header. */
  publicUrl?: string;
  /** Largest sweep an upload may expand to. */
  maxPoints?: number;
  /** Worker threads per background run. */
  workers?: number;
  /** Background runs at once; more uploads are refused with 429 until one ends. */
  maxConcurrentRuns?: number;
  loginLimit?: LoginLimit;
  /** Password-reset requests per client address and reset mails per account. */
  resetLimit?: ResetLimit;
  /** How often expired sessions are deleted (also once at start-up); default 10 minutes. */
  sessionSweepMs?: number;
  /** Where unexpected errors go (default console.error). */
  log?: (e: unknown) => void;
}

export interface AppContext {
  store: Store;
  options: Required<Omit<ServerOptions, 'store' | 'publicUrl' | 'trustProxy' | 'webDir' | 'loginLimit'>> &
    Pick<ServerOptions, 'publicUrl' | 'trustProxy' | 'webDir' | 'loginLimit'>;
  mailer: Mailer;
  background: BackgroundRuns;
  exports: ExportSlots;
}
