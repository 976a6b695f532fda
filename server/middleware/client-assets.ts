import { existsSync } from 'node:fs';
import path from 'node:path';
import type { RequestHandler } from 'express';

/** Content codings the build writes beside each text asset (scripts/build/precompress-assets.ts), best first. */
const CODINGS = [{ coding: 'br', suffix: '.br' }, { coding: 'gzip', suffix: '.gz' }] as const;
/** Vite's asset names: one file name, no folders. */
const ASSET_NAME = /^[\w.-]+$/;

/**
 * The built client's hashed assets (`/assets/name-hash.ext`): the brotli or gzip copy made at build
 * time when the browser accepts it, else the file itself, with a year's immutable cache (a new
 * build has new names). An asset gets only the headers that apply to a subresource: its type,
 * `nosniff` and a same-origin resource policy; the page's security headers (policy, framing,
 * transport) come with index.html. A name that is not there is a 404, never the page: a browser
 * still holding an older build's page asks for scripts that are gone.
 */
export function clientAssets(assetsDir: string): RequestHandler {
  const present = new Map<string, boolean>();
  const has = (name: string): boolean => {
    let found = present.get(name);
    if (found === undefined) present.set(name, (found = existsSync(path.join(assetsDir, name))));
    return found;
  };
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const name = req.path.slice(1);
    if (!ASSET_NAME.test(name) || !has(name)) {
      res.sendStatus(404);
      return;
    }
    // Every coding the browser takes (q > 0); of those, ours in our order (brotli is the smaller).
    const accepted = req.acceptsEncodings();
    const copy = CODINGS.find((c) => accepted.includes(c.coding) && has(name + c.suffix));
    res.type(path.extname(name));
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
    if (CODINGS.some((c) => has(name + c.suffix))) res.setHeader('Vary', 'Accept-Encoding');
    if (copy) res.setHeader('Content-Encoding', copy.coding);
    res.sendFile(path.join(assetsDir, name + (copy?.suffix ?? '')), { lastModified: false, cacheControl: false, acceptRanges: false }, (error) => {
      if (error) next(error);
    });
  };
}
