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
 */
export function securityHeaders(env: Env): RequestHandler {
  return helmet({
    contentSecurityPolicy: { useDefaults: false, directives: { ...CONTENT_SECURITY_POLICY, ...(env.HSTS ? { 'upgrade-insecure-requests': [] } : {}) } },
    frameguard: { action: 'deny' },
    referrerPolicy: { policy: 'same-origin' },
    strictTransportSecurity: env.HSTS ? { maxAge: env.HSTS_MAX_AGE_SECONDS, includeSubDomains: true } : false,
    // The API answers JSON and files to its own origin only.
    crossOriginResourcePolicy: { policy: 'same-origin' },
  });
}
