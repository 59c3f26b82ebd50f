// scripts/serve.mjs, the loopback server of browser mode, asked with raw HTTP requests: it serves
// its own page only. Host checking against DNS rebinding and Origin checking are common practice
// for local servers (RFC 9110 §7.2 Host, §15.5.20 421 Misdirected Request; RFC 6454 Origin);
// byte ranges follow RFC 9110 §14.
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rawRequest } from './raw-http-request';

interface Served { url: string; openUrl: string; key: string; cookie: string; close: () => Promise<void> }
type ParseRange = (header: string, size: number) => { start: number; end: number } | null;

let dir = '';
let server: Served;
let port = 0;
let parseRange: ParseRange;
const raw = Uint8Array.from({ length: 10_000 }, (_, i) => (i * 7) % 256);

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gleaner-serve-'));
  mkdirSync(join(dir, 'app', 'assets'), { recursive: true });
  mkdirSync(join(dir, 'demo', 'raw'), { recursive: true });
  writeFileSync(join(dir, 'app', 'index.html'), '<!doctype html><title>app</title>');
  writeFileSync(join(dir, 'app', 'assets', 'main.js'), 'export {};');
  writeFileSync(join(dir, 'demo', 'windows.csv'), 'window_id,f\nw1,1\n');
  writeFileSync(join(dir, 'demo', 'raw', 'S01.edf'), raw);
  writeFileSync(join(dir, 'secret.txt'), 'outside the served folders');
  symlinkSync(join(dir, 'secret.txt'), join(dir, 'demo', 'out.txt'));
  symlinkSync(join(dir, 'demo', 'windows.csv'), join(dir, 'demo', 'same.csv'));
  const mod = (await import(pathToFileURL(resolve(import.meta.dirname, '../../scripts/serve.mjs')).href)) as {
    serveApp: (o: object) => Promise<Served>;
    parseRange: ParseRange;
  };
  parseRange = mod.parseRange;
  server = await mod.serveApp({ port: 0, root: join(dir, 'app'), demoDir: join(dir, 'demo') });
  port = Number(new URL(server.url).port);
});

afterAll(async () => {
  await server?.close();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

const own = () => `Host: 127.0.0.1:${port}`;
const keyed = () => [own(), `Cookie: ${server.cookie}`];
const get = (target: string, headers: string[] = [own()]) => rawRequest(port, 'GET', target, headers);

describe('serve.mjs answers to its own address only', () => {
  it('serves the page to its own loopback names and port', async () => {
    for (const host of [`127.0.0.1:${port}`, `localhost:${port}`, `[::1]:${port}`, `LOCALHOST:${port}`]) {
      const r = await get('/', [`Host: ${host}`]);
      expect(r.status, host).toBe(200);
      expect(r.body.toString()).toContain('<title>app</title>');
    }
    expect((await get('/assets/main.js')).headers['content-type']).toBe('text/javascript; charset=utf-8');
  });

  it('refuses a foreign Host (a rebound name), another port, or none, with 421 or 400', async () => {
    for (const host of [`evil.example:${port}`, 'evil.example', `127.0.0.1:${port + 1}`, '127.0.0.1', `127.0.0.1.evil.example:${port}`, `0.0.0.0:${port}`]) {
      const r = await get('/', [`Host: ${host}`]);
      expect(r.status, host).toBe(421);
      expect(r.body.toString()).not.toContain('<title>');
    }
    for (const target of ['/demo/windows.csv', '/key/' + server.key + '/']) {
      expect((await get(target, [`Host: evil.example:${port}`, `Cookie: ${server.cookie}`])).status).toBe(421);
    }
    expect((await get('/', [])).status).toBe(400);
  });

  it('refuses a foreign Origin and requests another site started, with 403', async () => {
    for (const origin of ['http://evil.example', `http://evil.example:${port}`, 'null', `https://127.0.0.1:${port}`, `http://127.0.0.1:${port + 1}`]) {
      const r = await get('/demo/windows.csv', [...keyed(), `Origin: ${origin}`]);
      expect(r.status, origin).toBe(403);
    }
    expect((await get('/', [own(), 'Origin: http://evil.example'])).status).toBe(403);
    expect((await get('/demo/windows.csv', [...keyed(), 'Sec-Fetch-Site: cross-site'])).status).toBe(403);
    expect((await get('/demo/windows.csv', [...keyed(), `Origin: http://127.0.0.1:${port}`, 'Sec-Fetch-Site: same-origin'])).status).toBe(200);
  });

  it('serves GET and HEAD only', async () => {
    expect((await rawRequest(port, 'POST', '/', [own(), 'Content-Length: 0'])).status).toBe(405);
    expect((await rawRequest(port, 'PUT', '/demo/windows.csv', [...keyed(), 'Content-Length: 0'])).status).toBe(405);
    const head = await rawRequest(port, 'HEAD', '/demo/windows.csv', keyed());
    expect(head.status).toBe(200);
    expect(head.headers['content-length']).toBe('17');
    expect(head.body.length).toBe(0);
  });

  it('sets the same protective headers on files and refusals alike', async () => {
    for (const r of [await get('/'), await get('/nope'), await get('/', ['Host: evil.example'])]) {
      expect(r.headers['content-security-policy']).toContain("default-src 'self'");
      expect(r.headers['x-content-type-options']).toBe('nosniff');
      expect(r.headers['cache-control']).toBe('no-store');
      expect(r.headers['cross-origin-resource-policy']).toBe('same-origin');
    }
  });
});

describe("the demo's data needs this launch's key", () => {
  it('opening the printed address sets the key as a cookie and goes on to the page, keeping the query', async () => {
    const r = await get(`/key/${server.key}/?demo=1`);
    expect(r.status).toBe(303);
    expect(r.headers.location).toBe('/?demo=1');
    expect(r.headers['set-cookie']).toBe(`${server.cookie}; Path=/; HttpOnly; SameSite=Strict`);
    expect(server.openUrl).toBe(`${server.url}key/${server.key}/`);
    expect(server.key).toMatch(/^[0-9a-f]{32}$/);
  });

  it('refuses the data without the key or with another one, and a wrong key address', async () => {
    expect((await get('/demo/windows.csv')).status).toBe(403);
    expect((await get('/demo/windows.csv', [own(), `Cookie: ${server.cookie.replace(/.$/, (c) => (c === '0' ? '1' : '0'))}`])).status).toBe(403);
    expect((await get('/demo/windows.csv', [own(), `Cookie: gleaner-key-${port + 1}=${server.key}`])).status).toBe(403);
    expect((await get('/key/0123/')).status).toBe(403);
    expect((await get(`/key/${server.key}x/`)).status).toBe(403);
    const ok = await get('/demo/windows.csv', [own(), `Cookie: other=1; ${server.cookie}`]);
    expect(ok.status).toBe(200);
    expect(ok.body.toString()).toBe('window_id,f\nw1,1\n');
  });
});

describe('serve.mjs stays inside its folders', () => {
  it('refuses paths that climb out, plain, percent-encoded or double-encoded, with 400', async () => {
    const targets = [
      '/../secret.txt', '/demo/../../secret.txt', '/%2e%2e/secret.txt', '/demo/%2e%2e/secret.txt', '/demo/%2E%2E%2Fsecret.txt',
      '/demo/..%2f..%2fsecret.txt', '/demo/..%5csecret.txt', '/demo/%252e%252e/secret.txt', '/demo/%252e%252e%252fsecret.txt',
      '/demo/raw%2f..%2f..%2fsecret.txt', '//etc/passwd', '/demo//windows.csv', '/demo/./windows.csv', '/demo/windows.csv%00.png',
      '/demo/%E0%A4%A', '/demo/..\\..\\secret.txt', `http://127.0.0.1:${port}/demo/windows.csv`, '*',
    ];
    for (const target of targets) {
      const r = await get(target, keyed());
      expect(r.status, target).toBe(400);
      expect(r.body.toString()).not.toContain('outside the served folders');
    }
  });

  it('follows a symbolic link only when it ends inside the folder', async () => {
    const out = await get('/demo/out.txt', keyed());
    expect(out.status).toBe(404);
    expect(out.body.toString()).not.toContain('outside');
    expect((await get('/demo/same.csv', keyed())).status).toBe(200);
  });

  it('answers 404 for missing files and for folders', async () => {
    expect((await get('/nope.js')).status).toBe(404);
    expect((await get('/assets/')).status).toBe(404);
    expect((await get('/demo/raw', keyed())).status).toBe(404);
    expect((await get('/demo/', keyed())).status).toBe(404);
  });
});

describe('serve.mjs byte ranges', () => {
  it('parses single ranges and refuses the rest (RFC 9110 §14.1.2 forms a-b, a-, -n)', () => {
    expect(parseRange('bytes=0-9', 100)).toEqual({ start: 0, end: 9 });
    expect(parseRange('bytes=90-', 100)).toEqual({ start: 90, end: 99 });
    expect(parseRange('bytes=-5', 100)).toEqual({ start: 95, end: 99 });
    expect(parseRange('bytes=-500', 100)).toEqual({ start: 0, end: 99 });
    expect(parseRange('bytes=50-500', 100)).toEqual({ start: 50, end: 99 });
    for (const bad of ['bytes=100-', 'bytes=9-1', 'bytes=0-1,5-6', 'items=0-1', 'bytes=-0', 'bytes=-', 'bytes=1.5-2', 'bytes=0x10-', 'bytes= 1-2', 'bytes=1234567890123456-', 'bytes=0-99999999999999999999']) {
      expect(parseRange(bad, 100), bad).toBeNull();
    }
    expect(parseRange('bytes=0-', 0)).toBeNull();
    // Larger than one answer may carry (64 MiB).
    expect(parseRange('bytes=0-', 65 * 1024 * 1024)).toBeNull();
    expect(parseRange(`bytes=0-${64 * 1024 * 1024 - 1}`, 65 * 1024 * 1024)).toEqual({ start: 0, end: 64 * 1024 * 1024 - 1 });
  });

  it('answers 206 with Content-Range for one range, and 416 with the size for the rest', async () => {
    const r = await get('/demo/raw/S01.edf', [...keyed(), 'Range: bytes=100-199']);
    expect(r.status).toBe(206);
    expect(r.headers['content-range']).toBe('bytes 100-199/10000');
    expect(r.headers['content-length']).toBe('100');
    expect([...r.body]).toEqual([...raw.subarray(100, 200)]);
    for (const range of ['bytes=20000-', 'bytes=0-1,5-6', 'bytes=abc', 'bytes=99999999999999999999-', 'bytes=5-2']) {
      const bad = await get('/demo/raw/S01.edf', [...keyed(), `Range: ${range}`]);
      expect(bad.status, range).toBe(416);
      expect(bad.headers['content-range']).toBe('bytes */10000');
      expect(bad.body.length).toBe(0);
    }
  });
});
