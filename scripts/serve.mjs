// A loopback-only static server for the built renderer (browser mode), used by `npm start` and
// by the end-to-end tests. Serves dist/renderer at / and the demo study's files at /demo/.
//
// It serves its own page only (serve-guard.mjs): a request must name the server's own loopback
// address and port in Host, carry no foreign Origin, and stay inside the served folders. The demo's
// data also needs this launch's key: the page is opened at /key/<key>/, which sets the key as a
// cookie and sends the browser on to /; requests without it get 403. Headers: serve-headers.mjs.
import { randomBytes } from 'node:crypto';
import { createReadStream, statSync } from 'node:fs';
import { createServer } from 'node:http';
import { extname, resolve } from 'node:path';
import { headers, TYPES } from './serve-headers.mjs';
import { cookieValue, fileInside, keyCookieName, keyMatches, parseRange, pathSegments, refusal } from './serve-guard.mjs';

export { parseRange };

/** @param {import('node:http').ServerResponse} res */
function refuse(res, status, reason) {
  const body = `${reason}\n`;
  res.writeHead(status, headers({ 'content-type': 'text/plain; charset=utf-8', 'content-length': Buffer.byteLength(body) }));
  res.end(body);
}

/**
 * Answers with the file, whole or one byte range (the Traces view reads raw files in pieces).
 * @param {import('node:http').IncomingMessage} req
 * @param {import('node:http').ServerResponse} res
 * @param {string} file
 */
function sendFile(req, res, file) {
  const size = statSync(file).size;
  const base = { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream', 'accept-ranges': 'bytes' };
  let status = 200;
  let range = { start: 0, end: size - 1 };
  const rangeHeader = req.headers.range;
  if (rangeHeader !== undefined) {
    const parsed = parseRange(rangeHeader, size);
    if (parsed === null) {
      res.writeHead(416, headers({ ...base, 'content-range': `bytes */${size}`, 'content-length': 0 }));
      res.end();
      return;
    }
    status = 206;
    range = parsed;
    base['content-range'] = `bytes ${range.start}-${range.end}/${size}`;
  }
  res.writeHead(status, headers({ ...base, 'content-length': size === 0 ? 0 : range.end - range.start + 1 }));
  if (req.method === 'HEAD' || size === 0) {
    res.end();
    return;
  }
  createReadStream(file, { start: range.start, end: range.end })
    .on('error', () => res.destroy())
    .pipe(res);
}

/**
 * @param {{ port?: number, root?: string, demoDir?: string, key?: string }} options
 * @returns {Promise<{ url: string, openUrl: string, key: string, cookie: string, close: () => Promise<void> }>}
 *   `url` the server's address; `openUrl` the address to open the app with (it sets the key);
 *   `cookie` the Cookie header value a raw HTTP client sends for the demo's data.
 */
export function serveApp({ port = 0, root = 'dist/renderer', demoDir = 'demo-data', key = randomBytes(16).toString('hex') } = {}) {
  const appRoot = resolve(root);
  const demoRoot = resolve(demoDir);
  let ownPort = port;
  const server = createServer((req, res) => {
    const refused = refusal(req, ownPort);
    if (refused) return refuse(res, refused.status, refused.reason);
    const target = req.url ?? '/';
    if (!target.startsWith('/')) return refuse(res, 400, 'expected a path');
    const query = target.indexOf('?');
    const segments = pathSegments(query < 0 ? target : target.slice(0, query));
    if (segments === null) return refuse(res, 400, 'expected a plain path inside the served folder');
    const search = query < 0 ? '' : target.slice(query);
    const cookie = keyCookieName(ownPort);
    if (segments[0] === 'key') {
      if (segments.length !== 2 || !keyMatches(segments[1], key)) return refuse(res, 403, 'this is not the key of the running server; open the address it printed');
      res.writeHead(303, headers({ location: `/${search}`, 'set-cookie': `${cookie}=${key}; Path=/; HttpOnly; SameSite=Strict`, 'content-length': 0 }));
      return res.end();
    }
    let file;
    if (segments[0] === 'demo') {
      if (!keyMatches(cookieValue(req.headers.cookie, cookie), key)) return refuse(res, 403, "the demo's data needs this launch's key: open the address the server printed");
      file = fileInside(demoRoot, segments.slice(1));
    } else {
      file = fileInside(appRoot, segments.length === 0 ? ['index.html'] : segments);
    }
    if (!file) return refuse(res, 404, 'not found');
    sendFile(req, res, file);
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      ownPort = server.address().port;
      const url = `http://127.0.0.1:${ownPort}/`;
      resolvePromise({
        url,
        openUrl: `${url}key/${key}/`,
        key,
        cookie: `${keyCookieName(ownPort)}=${key}`,
        close: () =>
          new Promise((r) => {
            server.close(() => r());
            server.closeIdleConnections();
          }),
      });
    });
  });
}
