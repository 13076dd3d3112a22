/**
 * Cross-site request forgery defence for every state-changing request (OWASP CSRF Prevention
 * Cheat Sheet, "Verifying origin with standard headers"). Browsers attach Origin to every
 * cross-origin POST, PUT, PATCH and DELETE — forms, fetch and multipart uploads alike, with a
 * body or without — so a request whose Origin (or, failing that, Referer) is not this app's is
 * refused before any route runs. A request with neither header is refused only when it carries
 * the session cookie: only a browser sends that cookie on its own, and every browser we support
 * sends Origin. Non-browser callers without the cookie (mail providers' one-click unsubscribe,
 * scripts) hold no ambient credential to abuse.
 */
import type { Request, RequestHandler } from 'express';
import { ForbiddenError } from '../lib/errors';
import { SESSION_COOKIE } from '../lib/session';
import { boundedMemo } from '../lib/bounded-memo';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(url: string | undefined): string | null {
  if (!url) return null;
  try {
    const u = new URL(url);
    return u.protocol === 'http:' || u.protocol === 'https:' ? u.origin : null;
  } catch {
    return null;
  }
}

/** The origin the browser addressed: scheme (from the proxy when trusted) and Host header. */
function ownOrigin(req: Request, origin: (value: string) => string | null): string | null {
  const host = req.get('host');
  return host ? origin(`${req.protocol}://${host}`) : null;
}

/**
 * A browser sends the same Origin on every request, and parsing it as a URL each time was a
 * measurable part of an answer's CPU (bench:fieldwork): header values' origins are remembered.
 */
const ORIGINS_KEPT = 1_000;

export function refuseCrossSiteWrites(trustedOrigins: readonly string[]): RequestHandler {
  const trusted = new Set(trustedOrigins.map((o) => originOf(o)).filter((o) => o !== null));
  const headerOrigin = boundedMemo(originOf, ORIGINS_KEPT);
  const refuse = () =>
    new ForbiddenError(
      'This request did not come from a Choicewright page and was refused.',
      'cross_site_request',
    );
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const allowed = (o: string | null) =>
      o !== null && (trusted.has(o) || o === ownOrigin(req, headerOrigin));
    // An empty header counts as none (no browser sends one).
    const origin = req.get('origin') || undefined;
    if (origin !== undefined) return next(allowed(headerOrigin(origin)) ? undefined : refuse());
    const referer = req.get('referer') || undefined;
    if (referer !== undefined) return next(allowed(headerOrigin(referer)) ? undefined : refuse());
    const hasSession = typeof req.cookies?.[SESSION_COOKIE] === 'string';
    next(hasSession ? refuse() : undefined);
  };
}
