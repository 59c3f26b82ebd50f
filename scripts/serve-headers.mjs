// The one place where the loopback server (serve.mjs) sets response headers: every answer, file or
// refusal, goes through `headers()`. Add a header for all answers here, not at a call site.

/** Content types by extension; anything else is served as bytes. */
export const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.map': 'application/json; charset=utf-8',
  '.edf': 'application/octet-stream',
};

/** Sent with every answer. */
const COMMON = {
  'cache-control': 'no-store',
  // The app loads nothing from the network: say so to the browser as well.
  'content-security-policy': "default-src 'self'; img-src 'self' data: blob:; style-src 'self' 'unsafe-inline'; worker-src 'self' blob:; connect-src 'self'",
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'no-referrer',
  // Other sites may not embed or load what this server answers.
  'cross-origin-resource-policy': 'same-origin',
  'x-frame-options': 'DENY',
};

/**
 * The headers of one answer: the common ones, then `extra` (content type, length, range ...).
 * @param {Record<string, string | number>} [extra]
 * @returns {Record<string, string | number>}
 */
export function headers(extra = {}) {
  return { ...COMMON, ...extra };
}
