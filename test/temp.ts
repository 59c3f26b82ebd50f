import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

const made: string[] = [];

// Registered when a test file first imports this module, so it runs after that file's tests,
// whether they passed or failed.
afterAll(() => {
  for (const dir of made.splice(0)) rmSync(dir, { recursive: true, force: true });
});

/** A fresh folder under the temp folder, removed after the test file that made it. */
export function tempDir(prefix: string): string {
  const dir = mkdtempSync(join(tmpdir(), `gleaner-${prefix}-`));
  made.push(dir);
  return dir;
}
