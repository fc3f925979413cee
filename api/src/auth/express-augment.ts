import type { AuthUser } from './session-user.js';

declare global {
  namespace Express {
    // passport types req.user as Express.User; ours carries role and team.
    interface User extends AuthUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    passport?: { user?: string };
    /** Anti-forgery token bound to this session; echoed by the client in X-XSRF-TOKEN. */
    csrf?: string;
  }
}

export {};
