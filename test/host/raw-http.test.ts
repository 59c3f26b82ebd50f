// The demo's raw files over HTTP byte ranges: scripts/serve.mjs answers single ranges with 206
// (RFC 9110 §14, "Range Requests"), and httpRangeSource (src/host/raw-http.ts) reads through it.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { httpRangeSource, totalFromContentRange } from '../../src/host/raw-http.ts';

type Serve = (o: { port?: number; root?: string; demoDir?: string }) => Promise<{ url: string; close: () => Promise<void> }>;
type ParseRange = (header: string, size: number) => { start: number; end: number } | null;

let dir: string;
let server: { url: string; close: () => Promise<void> };
let parseRange: ParseRange;
const bytes = Uint8Array.from({ length: 10_000 }, (_, i) => (i * 7) % 256);

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gleaner-range-'));
  mkdirSync(join(dir, 'demo', 'raw'), { recursive: true });
  mkdirSync(join(dir, 'app'));
  writeFileSync(join(dir, 'demo', 'raw', 'S01.edf'), bytes);
  const mod = (await import(pathToFileURL(resolve(import.meta.dirname, '../../scripts/serve.mjs')).href)) as { serveApp: Serve; parseRange: ParseRange };
  parseRange = mod.parseRange;
  server = await mod.serveApp({ port: 0, root: join(dir, 'app'), demoDir: join(dir, 'demo') });
});

afterAll(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('serve.mjs byte ranges', () => {
  it('parses single ranges and refuses the rest (RFC 9110 §14.1.2 forms a-b, a-, -n)', () => {
    expect(parseRange('bytes=0-9', 100)).toEqual({ start: 0, end: 9 });
    expect(parseRange('bytes=90-', 100)).toEqual({ start: 90, end: 99 });
    expect(parseRange('bytes=-5', 100)).toEqual({ start: 95, end: 99 });
    expect(parseRange('bytes=50-500', 100)).toEqual({ start: 50, end: 99 });
    expect(parseRange('bytes=100-', 100)).toBeNull();
    expect(parseRange('bytes=9-1', 100)).toBeNull();
    expect(parseRange('bytes=0-1,5-6', 100)).toBeNull();
    expect(parseRange('items=0-1', 100)).toBeNull();
  });

  it('answers 206 with Content-Range, and 416 past the end', async () => {
    const r = await fetch(new URL('demo/raw/S01.edf', server.url), { headers: { range: 'bytes=100-199' } });
    expect(r.status).toBe(206);
    expect(r.headers.get('content-range')).toBe('bytes 100-199/10000');
    expect([...new Uint8Array(await r.arrayBuffer())]).toEqual([...bytes.subarray(100, 200)]);
    const past = await fetch(new URL('demo/raw/S01.edf', server.url), { headers: { range: 'bytes=20000-' } });
    expect(past.status).toBe(416);
    expect(past.headers.get('content-range')).toBe('bytes */10000');
  });

  it('still refuses paths that leave the demo folder', async () => {
    const r = await fetch(new URL('demo/..%2f..%2fetc/passwd', server.url), { headers: { range: 'bytes=0-9' } });
    expect(r.status).toBe(404);
  });
});

describe('httpRangeSource', () => {
  it('reads the ranges asked for and knows the size from the first answer', async () => {
    const source = await httpRangeSource(new URL('demo/raw/S01.edf', server.url));
    expect(source?.size).toBe(10_000);
    expect([...(await source!.read(10, 5))]).toEqual([...bytes.subarray(10, 15)]);
    expect([...(await source!.read(9_000, 5_000))]).toEqual([...bytes.subarray(9_000)]);
    expect((await source!.read(10_000, 10)).length).toBe(0);
  });

  it('gives null for a missing file', async () => {
    expect(await httpRangeSource(new URL('demo/raw/S99.edf', server.url))).toBeNull();
  });

  it('reads the total size from Content-Range', () => {
    expect(totalFromContentRange('bytes 0-4095/1337886')).toBe(1337886);
    expect(totalFromContentRange('bytes */50')).toBe(50);
    expect(totalFromContentRange(null)).toBeNull();
  });
});
