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
    res.writeHead(200, {
      'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
      'cache-control': 'no-store',
      // The app loads nothing from the network: say so to the browser as well.
      'content-security-policy': "default-src 'self'; img-src 'self' data: blob:; style-src 'self' 'unsafe-inline'; worker-src 'self' blob:; connect-src 'self'",
    });
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

