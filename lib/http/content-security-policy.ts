/**
 * The Content-Security-Policy of pages (route handlers get a stricter one in next.config.mjs). Pages get a fresh nonce per request (proxy.ts):
 * Next reads it from the request's CSP header and puts it on its own script tags, and
 * 'strict-dynamic' lets those scripts load the app's chunks. No 'unsafe-inline' for scripts.
 * Styles keep 'unsafe-inline': React renders `style` attributes into the server HTML (bars, chart
 * sizes, colour swatches) and Observable Plot writes a <style> element into each chart, neither of
 * which can carry a nonce.
 */
const BASE_DIRECTIVES = [
  "default-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "frame-ancestors 'none'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
];

/** For pages: scripts only with this request's nonce (and what they load). `next dev` also needs eval. */
export function pageContentSecurityPolicy(nonce: string, development = false): string {
  const script = `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ''}`;
  return [BASE_DIRECTIVES[0], script, ...BASE_DIRECTIVES.slice(1)].join('; ');
}
