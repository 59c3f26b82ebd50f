// The damaged inputs the fuzzer found (test/fixtures/fuzz-found/README.md), each read through the
// same path as in the campaign: each is refused with an InputError naming the file.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FILE_NAMES, classify, readAs } from './targets';
import type { FuzzFormat } from './seeds';

const DIR = join(import.meta.dirname, '../fixtures/fuzz-found');
const FOUND: [string, FuzzFormat][] = [
  ['arrow-footer-loop.arrow', 'arrow'],
  ['arrow-vector-length.arrow', 'arrow'],
  ['arrow-batch-length.arrow', 'arrow'],
  ['parquet-page-values.parquet', 'parquet'],
  ['parquet-unnamed-column.parquet', 'parquet'],
  ['parquet-level-run-overflow.parquet', 'parquet'],
  ['parquet-levels-past-length.parquet', 'parquet'],
  ['parquet-level-length-past-page.parquet', 'parquet'],
  ['arrow-head-magic-only.arrow', 'arrow'],
  ['study-k-2-31.gleaner', 'study'],
  ['study-split-k-2-31.gleaner', 'study'],
  ['study-labels-outside-k.gleaner', 'study'],
  ['study-bad-action.gleaner', 'study'],
];

describe('inputs the fuzzer found', () => {
  for (const [name, format] of FOUND) {
    it(`${name} is refused with an InputError naming the file`, async () => {
      const bytes = new Uint8Array(readFileSync(join(DIR, name)));
      for (const variant of [0, 1]) {
        const err = await readAs(format, bytes, variant).then(() => undefined, (e: unknown) => e);
        expect(classify(format, err), String(err)).toEqual({ outcome: 'refused' });
        expect(String((err as Error).message)).toMatch(new RegExp(`^${FILE_NAMES[format].replace('.', '\\.')}: expected `));
      }
    });
  }
});
