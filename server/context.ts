// Everything a route needs: the store, the settings, the mailer and the background runs.
import type { Store } from '../shared/db/store.js';
import type { BackgroundRuns } from './background.js';
import type { Mailer } from './mail.js';
import type { LoginLimit } from './middleware/rate-limit.js';

export interface ServerOptions {
  store: Store;
  /** Development mode: the mail outbox is readable at /api/outbox. Default: NODE_ENV !== 'production'. */
  dev?: boolean;
  /** bcrypt cost for new passwords (tests use 4). */
  bcryptCost?: number;
  sessionTtlMs?: number;
  /** Express `trust proxy` (set when behind an HTTPS proxy, so cookies get Secure). */
  trustProxy?: boolean | number | string;
  /** Folder of the built web app; null to serve the API only. Default: dist/web when present. */
  webDir?: string | null;
  /** Base of links in e-mails; default: the request's own origin. */
  publicUrl?: string;
  /** Largest sweep an upload may expand to. */
  maxPoints?: number;
  /** Worker threads per background run. */
  workers?: number;
  /** Background runs at once; more uploads are refused with 429 until one ends. */
  maxConcurrentRuns?: number;
  loginLimit?: LoginLimit;
  /** Where unexpected errors go (default console.error). */
  log?: (e: unknown) => void;
}

export interface AppContext {
  store: Store;
  options: Required<Omit<ServerOptions, 'store' | 'publicUrl' | 'trustProxy' | 'webDir' | 'loginLimit'>> &
    Pick<ServerOptions, 'publicUrl' | 'trustProxy' | 'webDir' | 'loginLimit'>;
  mailer: Mailer;
  background: BackgroundRuns;
}
