import type { Request, RequestHandler, Response } from 'express';
import type { Session, User } from 'lucia';
import type { AppLucia } from '../auth/lucia';
import { UnauthenticatedError } from './errors';

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by `sessionMiddleware`: the signed-in user and session, or null. */
    auth?: { user: User; session: Session } | null;
  }
}

/** Sets the session cookie; Secure only when the request came over HTTPS (LAN use is plain HTTP). */
export function setSessionCookie(
  lucia: AppLucia,
  req: Request,
  res: Response,
  sessionId: string | null,
) {
  const cookie =
    sessionId === null ? lucia.createBlankSessionCookie() : lucia.createSessionCookie(sessionId);
  res.append(
    'Set-Cookie',
    cookie.serialize().replace(/; Secure/i, '') + (req.secure ? '; Secure' : ''),
  );
}

/** Reads the session cookie, validates it, and extends it when lucia says it is fresh. */
export function sessionMiddleware(lucia: AppLucia): RequestHandler {
  return async (req, res, next) => {
    const id = lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!id) {
      req.auth = null;
      next();
      return;
    }
    const { session, user } = await lucia.validateSession(id);
    if (!session) {
      setSessionCookie(lucia, req, res, null);
      req.auth = null;
    } else {
      if (session.fresh) setSessionCookie(lucia, req, res, session.id);
      req.auth = { session, user };
    }
    next();
  };
}

/** The signed-in user, or 401. */
export function requireUser(req: Request): User {
  if (!req.auth) throw new UnauthenticatedError();
  return req.auth.user;
}
