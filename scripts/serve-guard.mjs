// What the loopback server (serve.mjs) accepts: requests addressed to its own loopback name and
// port, from no other web origin, for GET or HEAD, with a path that stays inside the folder it
// serves, and at most one well-formed byte range. Everything else is refused before a file is touched.
import { realpathSync, statSync } from 'node:fs';
import { sep } from 'node:path';
import { timingSafeEqual } from 'node:crypto';

/** The names the server answers to: the loopback address it listens on and its usual aliases. */
const LOOPBACK_NAMES = ['127.0.0.1', 'localhost', '[::1]'];

/** The Host values accepted for a server on `port` (RFC 9110 §7.2: host [":" port]). */
export function ownHosts(port) {
  const hosts = LOOPBACK_NAMES.map((name) => `${name}:${port}`);
  if (port === 80) hosts.push(...LOOPBACK_NAMES);
  return hosts;
}

/** The web origins of the server's own page (RFC 6454: scheme, host, port). */
export function ownOrigins(port) {
  return LOOPBACK_NAMES.map((name) => (port === 80 ? `http://${name}` : `http://${name}:${port}`));
}

/**
 * Refuses requests that are not for this server or come from another web page: a Host other than
 * its own loopback name and port (the defence against DNS rebinding: a foreign name resolved to
 * 127.0.0.1 still carries that name), an Origin other than its own, a fetch another site started,
 * and methods other than GET and HEAD.
 * @param {import('node:http').IncomingMessage} req
 * @param {number} port
 * @returns {{ status: number, reason: string } | null} null when the request may go on
 */
export function refusal(req, port) {
  const host = req.headers.host;
  if (host === undefined) return { status: 400, reason: 'a Host header is required' };
  if (!ownHosts(port).includes(host.toLowerCase())) return { status: 421, reason: `this server answers only to ${ownHosts(port)[0]}` };
  const origin = req.headers.origin;
  if (origin !== undefined && !ownOrigins(port).includes(origin.toLowerCase())) return { status: 403, reason: 'requests from other web pages are refused' };
  // Fetch Metadata (W3C): a request another site's page made, e.g. <img src> or a form, is refused.
  if (req.headers['sec-fetch-site'] === 'cross-site') return { status: 403, reason: 'requests from other web pages are refused' };
  if (req.method !== 'GET' && req.method !== 'HEAD') return { status: 405, reason: 'only GET and HEAD are served' };
  return null;
}

/**
 * The decoded segments of a URL path, or null when it is malformed or could mean anything but a
 * plain relative path: bad percent-encoding, "." or ".." segments, empty segments, backslashes,
 * NUL or other control characters, and "%" left after decoding (a double-encoded path).
 * @param {string} pathname the raw path of the request URL, still percent-encoded
 * @returns {string[] | null}
 */
export function pathSegments(pathname) {
  if (!pathname.startsWith('/')) return null;
  const raw = pathname.slice(1).split('/');
  const segments = [];
  for (let i = 0; i < raw.length; i++) {
    let s;
    try {
      s = decodeURIComponent(raw[i]);
    } catch {
      return null;
    }
    if (s === '' && i === raw.length - 1) break; // a trailing slash
    if (s === '' || s === '.' || s === '..' || s.includes('/') || s.includes('\\') || s.includes('%')) return null;
    // eslint-disable-next-line no-control-regex
    if (/[\u0000-\u001f\u007f]/.test(s)) return null;
    segments.push(s);
  }
  return segments;
}

/**
 * The real path of a regular file at `segments` under `root`, or null when there is none or when
 * it lies outside `root` once symbolic links are followed.
 * @param {string} root an absolute folder
 * @param {string[]} segments
 * @returns {string | null}
 */
export function fileInside(root, segments) {
  let realRoot;
  let real;
  try {
    realRoot = realpathSync(root);
    real = realpathSync([root, ...segments].join(sep));
  } catch {
    return null;
  }
  if (!real.startsWith(realRoot + sep)) return null;
  try {
    return statSync(real).isFile() ? real : null;
  } catch {
    return null;
  }
}

/** Largest byte range served in one answer (the readers ask for a few records at a time). */
export const MAX_RANGE_BYTES = 64 * 1024 * 1024;

/**
 * One byte range "bytes=a-b", "bytes=a-" or "bytes=-n" (RFC 9110 §14.1.2) clipped to the file, or
 * null when it is malformed, asks for several ranges, starts past the end, or is larger than
 * MAX_RANGE_BYTES. Positions have at most 15 digits, so they are exact integers.
 * @param {string} header
 * @param {number} size
 * @returns {{ start: number, end: number } | null}
 */
export function parseRange(header, size) {
  const m = /^bytes=(\d{0,15})-(\d{0,15})$/.exec(header.trim());
  if (!m || (m[1] === '' && m[2] === '') || size === 0) return null;
  let start, end;
  if (m[1] === '') {
    const suffix = Number(m[2]);
    if (suffix === 0) return null;
    start = Math.max(0, size - suffix);
    end = size - 1;
  } else {
    start = Number(m[1]);
    end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  }
  if (start > end || start >= size) return null;
  if (end - start + 1 > MAX_RANGE_BYTES) return null;
  return { start, end };
}

/** The per-launch key's cookie name: one per port, so two servers on one machine keep theirs. */
export function keyCookieName(port) {
  return `gleaner-key-${port}`;
}

/** The value of cookie `name` in a Cookie header (RFC 6265 §5.4), or null. */
export function cookieValue(header, name) {
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return null;
}

/** True when `given` equals the key, compared in constant time. */
export function keyMatches(given, key) {
  if (typeof given !== 'string') return false;
  const a = Buffer.from(given);
  const b = Buffer.from(key);
  return a.length === b.length && timingSafeEqual(a, b);
}
