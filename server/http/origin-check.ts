import type { RequestHandler } from 'express';
import { ForbiddenError } from './errors';

const safe = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that a browser sent from another site. Browsers always send
 * Origin on cross-site POST/PUT/PATCH/DELETE; the session cookie is SameSite=Lax as a second
 * line. Requests without Origin or Referer come from non-browser clients (CLI, scripts) that
 * cannot ride on a victim's cookie.
 *
 * The allowed origins are PUBLIC_URL's (plus the Vite dev server's in development). The Host
 * header is the client's to choose, so it counts only behind a proxy we were told to trust
 * (TRUST_PROXY), where Express reads the proxy's X-Forwarded-Host.
 */
export function originCheck(allowedOrigins: string[], trustProxy: boolean): RequestHandler {
  const allowed = new Set(allowedOrigins.map((o) => new URL(o).origin));
  return (req, _res, next) => {
    if (safe.has(req.method)) {
      next();
      return;
    }
    const source = req.headers.origin ?? req.headers.referer;
    if (!source) {
      next();
      return;
    }
    let origin: string;
    try {
      origin = new URL(source).origin;
    } catch {
      throw new ForbiddenError('The request came from an unreadable origin.');
    }
    const own = trustProxy && req.host ? `${req.protocol}://${req.host}` : null;
    if (origin === own || allowed.has(origin)) {
      next();
      return;
    }
    throw new ForbiddenError('The request came from another site.');
  };
}
