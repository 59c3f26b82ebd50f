import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BAD_INPUTS } from '../fixtures/bad-inputs';
import { hasStackTrace, runCli, tempDir } from './run-cli';

describe('gleaner analyze on bad input files', () => {
  for (const bad of BAD_INPUTS) {
    it(`${bad.name}: exits 1 with one line naming the problem, no stack trace, nothing written`, () => {
      const dir = tempDir('bad');
      const input = join(dir, bad.fileName);
      writeFileSync(input, bad.content);
      const out = join(dir, 'out');
      const r = runCli(['analyze', input, '--k', '2', '--out', out]);
      expect(r.status).toBe(1);
      // Notes on what was read as missing may come first (the all-NaN column's explains its error).
      const lines = r.stderr.trimEnd().split('\n').filter((l) => !l.startsWith('gleaner: note: '));
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^gleaner: /);
      expect(lines[0]).toMatch(bad.expected);
      expect(hasStackTrace(r.stderr)).toBe(false);
      expect(existsSync(join(out, 'windows.csv'))).toBe(false);
    });
  }
});
