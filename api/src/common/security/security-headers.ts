import type { RequestHandler } from 'express';
import helmet from 'helmet';
import type { Env } from '../../config/env';

/**
 * The Content-Security-Policy every response carries. The web app loads only its own
 * scripts; style-src keeps 'unsafe-inline' because Mantine writes its CSS variables into
 * <style> elements at run time. pdf.js renders datasheets from a same-origin worker and may
 * draw page images as data:/blob: URLs. Nothing may frame the app (clickjacking).
 */
export const CONTENT_SECURITY_POLICY = {
  'default-src': ["'self'"],
  'base-uri': ["'self'"],
  'script-src': ["'self'"],
  'script-src-attr': ["'none'"],
  'style-src': ["'self'", "'unsafe-inline'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'", 'data:'],
  'connect-src': ["'self'"],
  'worker-src': ["'self'", 'blob:'],
  'object-src': ["'none'"],
  'frame-src': ["'none'"],
  'frame-ancestors': ["'none'"],
  'form-action': ["'self'"],
} as const;

/**
 * helmet with our policy: CSP, X-Frame-Options DENY, nosniff, a same-origin referrer, and
 * Strict-Transport-Security only when HSTS is on (the site is served over TLS; browsers
 * would otherwise pin plain-http loopback to https).
 *
 * helmet's answer does not depend on the request (no nonces, no per-request directives), so
 * it is taken once, at start, from helmet itself, and each request gets the same headers in
 * one middleware: helmet's own chain ran a dozen middlewares and re-checked each header per
 * request (about 2 % of a card read's CPU).
 */
export function securityHeaders(env: Env): RequestHandler {
  const chain = helmet({
    contentSecurityPolicy: { useDefaults: false, directives: { ...CONTENT_SECURITY_POLICY, ...(env.HSTS ? { 'upgrade-insecure-requests': [] } : {}) } },
    frameguard: { action: 'deny' },
    referrerPolicy: { policy: 'same-origin' },
    strictTransportSecurity: env.HSTS ? { maxAge: env.HSTS_MAX_AGE_SECONDS, includeSubDomains: true } : false,
    // The API answers JSON and files to its own origin only.
    crossOriginResourcePolicy: { policy: 'same-origin' },
  });
  const set: Array<[string, string]> = [];
  const removed: string[] = [];
  let finished = false;
  const recorder = {
    setHeader: (name: string, value: unknown) => void set.push([name, String(value)]),
    removeHeader: (name: string) => void removed.push(name),
  };
  chain({ headers: {} } as Parameters<RequestHandler>[0], recorder as unknown as Parameters<RequestHandler>[1], (error?: unknown) => {
    if (error) throw error instanceof Error ? error : new Error(String(error));
    finished = true;
  });
  if (!finished || set.length === 0) throw new Error('helmet did not answer synchronously; the security headers cannot be precomputed');
  return (_req, res, next) => {
    for (const name of removed) res.removeHeader(name);
    for (const [name, value] of set) res.setHeader(name, value);
    next();
  };
}
