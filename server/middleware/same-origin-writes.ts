import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors';

/** The header our client sends on every request; another site cannot add it without a preflight we never grant. */
export const CLIENT_HEADER = 'X-Requested-With';

const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const crossSite = () =>
  new AppError(403, 'cross_site', 'This request came from another site and was refused. Open Tarnish itself and try again.');

const originOf = (url: string): string | null => {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
};

/** JSON bodies cannot be sent cross-site without a preflight either. */
const isJson = (req: Request) => /^application\/json\b/i.test(req.get('content-type') ?? '');

/**
 * Refuses state-changing requests from other sites (cross-site request forgery): a write is
 * let through only when the browser does not say it came from elsewhere — `Sec-Fetch-Site` is
 * `same-origin` (or absent) and `Origin`, when sent, is ours (the public URL or the host the
 * request was sent to) — and it carries JSON or our client header, which a plain HTML form
 * or a cross-site `fetch` without a preflight cannot. Reads are never refused here.
 * Server-to-server calls (the payment webhook) send neither header and post JSON.
 */
export function sameOriginWrites(publicUrl: string): RequestHandler {
  const ours = originOf(publicUrl);
  return (req, _res, next) => {
    if (!WRITES.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    if (site && site !== 'same-origin') throw crossSite();
    const origin = req.get('origin');
    if (origin !== undefined && origin !== ours && origin !== `${req.protocol}://${req.get('host')}`) throw crossSite();
    if (!isJson(req) && !req.get(CLIENT_HEADER)) throw crossSite();
    next();
  };
}
