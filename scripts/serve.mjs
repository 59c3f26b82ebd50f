// A loopback-only static server for the built renderer (browser mode), used by `npm start` and
// by the end-to-end tests. Serves dist/renderer at / and the demo study's files at /demo/.
import { createReadStream, existsSync, statSync } from 'node:fs';
import { createServer } from 'node:http';
import { extname, normalize, resolve, sep } from 'node:path';

const TYPES = {
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

/** Resolves a URL path inside `root`, or null when it would leave it. */
function inside(root, urlPath) {
  const p = normalize(decodeURIComponent(urlPath)).replace(/^([/\\])+/, '');
  const full = resolve(root, p);
  return full === root || full.startsWith(root + sep) ? full : null;
}

/** Largest byte range served in one answer (the readers ask for a few records at a time). */
const MAX_RANGE_BYTES = 64 * 1024 * 1024;

/**
 * One byte range "bytes=a-b", "bytes=a-" or "bytes=-n" clipped to the file, or null when it is
 * malformed, asks for several ranges, starts past the end or is larger than MAX_RANGE_BYTES.
 * @param {string} header
 * @param {number} size
 * @returns {{ start: number, end: number } | null}
 */
export function parseRange(header, size) {
  const m = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
  if (!m || (m[1] === '' && m[2] === '') || size === 0) return null;
  let start, end;
  if (m[1] === '') {
    start = Math.max(0, size - Number(m[2]));
    end = size - 1;
  } else {
    start = Number(m[1]);
    end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  }
  if (!Number.isSafeInteger(start) || !Number.isSafeInteger(end) || start > end || start >= size) return null;
  if (end - start + 1 > MAX_RANGE_BYTES) return null;
  return { start, end };
}

/**
 * @param {{ port?: number, root?: string, demoDir?: string }} options
 * @returns {Promise<{ url: string, close: () => Promise<void> }>}
 */
export function serveApp({ port = 0, root = 'dist/renderer', demoDir = 'demo-data' } = {}) {
  const appRoot = resolve(root);
  const demoRoot = resolve(demoDir);
  const server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    let file;
    if (url.pathname.startsWith('/demo/')) file = inside(demoRoot, url.pathname.slice('/demo/'.length));
    else file = inside(appRoot, url.pathname === '/' ? 'index.html' : url.pathname);
    if (!file || !existsSync(file) || !statSync(file).isFile()) {
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('not found');
      return;
    }
    const headers = {
      'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
      'cache-control': 'no-store',
      'accept-ranges': 'bytes',
      // The app loads nothing from the network: say so to the browser as well.
      'content-security-policy': "default-src 'self'; img-src 'self' data: blob:; style-src 'self' 'unsafe-inline'; worker-src 'self' blob:; connect-src 'self'",
    };
    const size = statSync(file).size;
    const rangeHeader = req.headers.range;
    if (rangeHeader !== undefined) {
      // The Traces view reads raw files in pieces: one byte range per request (RFC 9110 §14).
      const range = parseRange(rangeHeader, size);
      if (range === null) {
        res.writeHead(416, { ...headers, 'content-range': `bytes */${size}` });
        res.end();
        return;
      }
      res.writeHead(206, { ...headers, 'content-range': `bytes ${range.start}-${range.end}/${size}`, 'content-length': range.end - range.start + 1 });
      createReadStream(file, { start: range.start, end: range.end }).pipe(res);
      return;
    }
    res.writeHead(200, { ...headers, 'content-length': size });
    createReadStream(file).pipe(res);
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const { port: actual } = server.address();
      resolvePromise({
        url: `http://127.0.0.1:${actual}/`,
        close: () => new Promise((r) => server.close(() => r())),
      });
    });
  });
}

