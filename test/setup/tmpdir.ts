// Vitest setup file (both projects): every test file runs with TMPDIR set to a fresh folder of its
// own, which child processes (the CLI, Chromium) inherit, and which is removed after the file. A
// file whose tests leave anything there fails, naming what was left: each test removes what it
// makes (test/temp.ts does it for folders made with tempDir), also when it fails.
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

/** Caches that tools keep in TMPDIR on their own: tsx's compile cache (`node --import tsx` children). */
const TOOL_CACHES = [/^tsx-\d+$/];

const outer = process.env.TMPDIR;
const mine = mkdtempSync(join(tmpdir(), 'gleaner-test-'));
process.env.TMPDIR = mine;

afterAll(() => {
  if (outer === undefined) delete process.env.TMPDIR;
  else process.env.TMPDIR = outer;
  const left = readdirSync(mine).filter((name) => !TOOL_CACHES.some((re) => re.test(name)));
  rmSync(mine, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
  if (left.length > 0) throw new Error(`this test file left ${left.length} entr${left.length === 1 ? 'y' : 'ies'} in the temp folder: ${left.sort().join(', ')}`);
});
