import 'express-session';
import type { AuthMember } from '../middleware/authenticate';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
    csrfToken?: string;
    signedInAt?: number;
  }
}

declare global {
  namespace Express {
    interface Request {
      /** The signed-in member, set by authenticate(); undefined for visitors. */
      member?: AuthMember;
    }
  }
}

export {};
