// What the middleware attaches to a request.
import type { User } from '../shared/db/users.js';
import type { RouteAccess } from './access.js';

export interface Auth {
  user: User;
  via: 'session' | 'token';
  /** Present when signed in by cookie. */
  session?: { id: string; csrfToken: string };
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      auth?: Auth;
      route_access?: RouteAccess;
    }
  }
}

export {};
