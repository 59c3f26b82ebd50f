import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { BAD_INPUT_CATALOGUE, generateBadInputs } from '../fixtures/generate-bad-inputs';
import { hasStackTrace, runCli, tempDir } from './run-cli';

// The whole catalogue, text and binary, generated into a temp folder by the fixture script and run
// through the CLI one case at a time.
const dir = tempDir('catalogue');

beforeAll(async () => {
  await generateBadInputs(dir);
}, 60_000);

describe('gleaner analyze on the generated bad-input catalogue', () => {
  it('covers every kind of bad input the issue lists', () => {
    const names = BAD_INPUT_CATALOGUE.map((c) => c.fileName);
    for (const f of ['empty.csv', 'header-only.csv', 'ragged.csv', 'unterminated-quote.csv', 'mixed-delimiters.csv', 'text-in-feature.csv', 'inf.csv', 'duplicate-header.csv', 'all-nan.csv', 'duplicate-ids.csv', 'one-window-subject.csv', 'latin1.csv', 'truncated.parquet', 'zero.csv', 'zero.parquet']) {
      expect(names).toContain(f);
    }
  });

  for (const c of BAD_INPUT_CATALOGUE) {
    it(`${c.name}: exits ${c.exit} with one stderr line naming the problem`, () => {
      const out = join(dir, `out-${c.fileName}`);
      const r = runCli(['analyze', join(dir, c.fileName), '--k', '2', '--out', out]);
      expect(r.status).toBe(c.exit);
      // Notes on what was read as missing may come first (the all-NaN column's explains its error).
      const lines = r.stderr.trimEnd().split('\n').filter((l) => !l.startsWith('gleaner: note: '));
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^gleaner: /);
      expect(lines[0]).toMatch(c.expected);
      expect(hasStackTrace(r.stderr)).toBe(false);
      // Refused input writes nothing; input accepted with a warning is analysed.
      expect(existsSync(join(out, 'windows.csv'))).toBe(c.exit === 0);
    });
  }
});
