import type { SessionUser } from '../shared/auth/schemas';

declare global {
  namespace Express {
    // passport puts the deserialised user here.
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfIssued?: boolean;
  }
}

export {};
