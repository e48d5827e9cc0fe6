import type { ServerResponse } from 'node:http';
import { relative, resolve, sep } from 'node:path';

/**
 * Files with fixed names that say which build the browser runs: the service worker, the script
 * that registers it, the web manifest and the shell. They must be revalidated on every load (the
 * ETag keeps that cheap), or a new deploy waits for the old copy's cache to run out.
 */
const revalidated = new Set(['sw.js', 'registerSW.js', 'manifest.webmanifest', 'index.html']);

/** Vite names everything under assets/ by content hash, so a new build never reuses a name. */
const hashedDir = 'assets';

/**
 * `setHeaders` for express.static over the built client in `dist`; files it leaves alone keep
 * the static middleware's own max-age.
 */
export function clientCacheHeaders(dist: string) {
  const root = resolve(dist);
  return (res: ServerResponse, file: string) => {
    const parts = relative(root, file).split(sep);
    if (parts.length === 1 && revalidated.has(parts[0]!))
      res.setHeader('Cache-Control', 'no-cache');
    else if (parts[0] === hashedDir)
      res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
  };
}
