import 'express-session';
import type { AccessCache } from '../auth/access-cache';

declare global {
  namespace Express {
    /** The signed-in account as passport attaches it to req.user. */
    interface User {
      id: number;
      email: string;
      displayName: string;
      isAdmin: boolean;
      sessionVersion: number;
    }

    interface Request {
      /** Accounts and memberships kept between requests (server/auth/access-cache.ts); set by app.ts. */
      accessCache?: AccessCache;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    /** Set when a CSRF token is issued, so an anonymous session is stored and its id stays stable. */
    csrfIssued?: boolean;
  }
}
