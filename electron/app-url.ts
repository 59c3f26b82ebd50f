/**
 * The app protocol: the renderer is served from `gleaner-app://app/` out of dist/renderer. Pure
 * URL and path rules (node:path only, no electron), unit-tested in test/host/app-url.test.ts.
 */
import { extname, isAbsolute, relative, resolve } from 'node:path';

export const APP_SCHEME = 'gleaner-app';
export const APP_HOST = 'app';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;

/** The page main loads; `demo` opens the demo study on start. */
export function appEntryUrl(demo: boolean): string {
  return `${APP_ORIGIN}/index.html${demo ? '?demo=1' : ''}`;
}

/** True when a frame URL is a page of our app (IPC from anything else is refused). */
export function isAppUrl(url: string | undefined | null): boolean {
  if (typeof url !== 'string') return false;
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return false;
  }
  return parsed.protocol === `${APP_SCHEME}:` && parsed.host === APP_HOST && parsed.username === '' && parsed.password === '';
}

/**
 * The file under `root` that an app URL names, or null when the URL is not ours or would leave
 * root (encoded '..', backslashes, absolute paths). "/" is index.html.
 */
export function resolveAppFile(root: string, url: string): string | null {
  if (!isAppUrl(url)) return null;
  let path: string;
  try {
    path = decodeURIComponent(new URL(url).pathname);
  } catch {
    return null;
  }
  if (path.includes('\0') || path.includes('\\')) return null;
  const rel = path === '/' || path === '' ? 'index.html' : path.replace(/^\/+/, '');
  const base = resolve(root);
  const full = resolve(base, rel);
  const inside = relative(base, full);
  if (inside === '' || inside.startsWith('..') || isAbsolute(inside)) return null;
  return full;
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
};

export function contentTypeOf(file: string): string {
  return TYPES[extname(file).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The renderer's Content-Security-Policy: only our own origin; no network, no plugins, no frames,
 * no eval. Inline styles stay allowed for Svelte's style attributes.
 */
export const APP_CSP = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "worker-src 'self' blob:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-src 'none'",
  "frame-ancestors 'none'",
].join('; ');

/** URLs the app's session may load: its own protocol and in-memory data; never the network. */
export function isAllowedRequestUrl(url: string): boolean {
  return url.startsWith(`${APP_ORIGIN}/`) || url.startsWith('data:') || url.startsWith('blob:') || url.startsWith('devtools:');
}
