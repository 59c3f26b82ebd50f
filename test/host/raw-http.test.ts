// The demo's raw files over HTTP byte ranges: scripts/serve.mjs answers single ranges with 206
// (RFC 9110 §14, "Range Requests"), and httpRangeSource (src/host/raw-http.ts) reads through it.
// The server itself is tested with raw requests in test/scripts/serve.test.ts.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { httpRangeSource, totalFromContentRange } from '../../src/host/raw-http.ts';

type Serve = (o: { port?: number; root?: string; demoDir?: string }) => Promise<{ url: string; cookie: string; close: () => Promise<void> }>;

let dir: string;
let server: { url: string; cookie: string; close: () => Promise<void> };
/** fetch with the server's key, as the page sends it after opening the app's address. */
const keyed: typeof fetch = (input, init) => fetch(input, { ...init, headers: { ...(init?.headers as Record<string, string>), cookie: server.cookie } });
const bytes = Uint8Array.from({ length: 10_000 }, (_, i) => (i * 7) % 256);

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gleaner-range-'));
  mkdirSync(join(dir, 'demo', 'raw'), { recursive: true });
  mkdirSync(join(dir, 'app'));
  writeFileSync(join(dir, 'demo', 'raw', 'S01.edf'), bytes);
  const mod = (await import(pathToFileURL(resolve(import.meta.dirname, '../../scripts/serve.mjs')).href)) as { serveApp: Serve };
  server = await mod.serveApp({ port: 0, root: join(dir, 'app'), demoDir: join(dir, 'demo') });
});

afterAll(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('httpRangeSource', () => {
  it('reads the ranges asked for and knows the size from the first answer', async () => {
    const source = await httpRangeSource(new URL('demo/raw/S01.edf', server.url), keyed);
    expect(source?.size).toBe(10_000);
    expect([...(await source!.read(10, 5))]).toEqual([...bytes.subarray(10, 15)]);
    expect([...(await source!.read(9_000, 5_000))]).toEqual([...bytes.subarray(9_000)]);
    expect((await source!.read(10_000, 10)).length).toBe(0);
  });

  it('gives null for a missing file', async () => {
    expect(await httpRangeSource(new URL('demo/raw/S99.edf', server.url), keyed)).toBeNull();
  });

  it('reads the total size from Content-Range', () => {
    expect(totalFromContentRange('bytes 0-4095/1337886')).toBe(1337886);
    expect(totalFromContentRange('bytes */50')).toBe(50);
    expect(totalFromContentRange(null)).toBeNull();
  });
});
