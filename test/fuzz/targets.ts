// What the fuzzer feeds each mutant to: the same code paths the app and the CLI use to open that
// kind of file, through to the first things done with what was read. A mutant is "read" when the
// path ends normally, "refused" when it throws the project's located error (InputError naming the
// file; OptionError, prefixed with the file name, for a recipe's options), and anything else is a
// finding.
import { InputError, OptionError } from '../../src/core/errors';
import { quietContext } from '../../src/core/job';
import { bytesSource } from '../../src/core/raw/byte-source';
import { openEdf } from '../../src/core/raw/edf/read';
import { applyRecipe } from '../../src/core/recipe/apply';
import { parseRecipe } from '../../src/core/recipe/parse-recipe';
import { decodeStudy } from '../../src/core/study/decode';
import { runCuration } from '../../src/core/study/run-curation';
import { checkTable } from '../../src/core/table/checks';
import { featureMatrix } from '../../src/core/table/matrix';
import { createTableReader, readTableSource } from '../../src/core/table/reader';
import type { TableFormat } from '../../src/core/table/reader.types';
import { inferRoles } from '../../src/core/table/roles';
import type { Table } from '../../src/core/table/table';
import { AllocationRefused } from './allocation-refused';
import type { FuzzFormat } from './seeds';

export const FILE_NAMES: Record<FuzzFormat, string> = {
  csv: 'fuzz.csv', parquet: 'fuzz.parquet', arrow: 'fuzz.arrow', edf: 'fuzz.edf', study: 'fuzz.gleaner', recipe: 'fuzz-recipe.json',
};

/** After reading: column roles, the table checks and the feature matrix, as a run starts them. */
function useTable(table: Table): void {
  const roles = inferRoles(table);
  checkTable(table, roles);
  featureMatrix(table, roles);
}

/** Pushed in one piece or cut in two at `cut` (chunk boundaries are where streamed readers differ). */
async function pushed(format: TableFormat, bytes: Uint8Array, variant: number): Promise<Table> {
  const reader = createTableReader(format, FILE_NAMES[format === 'csv' ? 'csv' : format], { totalBytes: bytes.length });
  if (variant % 2 === 0 || bytes.length < 2) reader.push(bytes);
  else {
    const cut = (variant * 7919) % bytes.length;
    reader.push(bytes.subarray(0, cut));
    reader.push(bytes.subarray(cut));
  }
  return reader.finish(quietContext);
}

/** A small matrix with missing values and two subjects, for recipes to run on. */
function recipeMatrix() {
  const data = Float64Array.from([1, 2, NaN, 4, 0.5, 6, 7, 8, 1e-3, 10, NaN, 12, 13, 14, 15, -16, 17, 18, 1, 1, 1, 22, 23, 0]);
  return { data, n: 8, d: 3, featureNames: ['f1', 'f2', 'f3'], subjectCodes: Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1]) };
}

/** The recipe file path of the CLI (src/cli/recipe-options.ts): JSON, validation, then the recipe run. */
async function recipeFile(bytes: Uint8Array): Promise<void> {
  const file = FILE_NAMES.recipe;
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder().decode(bytes));
  } catch (err) {
    throw new InputError({ file, expected: 'a recipe in JSON', found: err instanceof Error ? err.message : String(err) });
  }
  let recipe;
  try {
    recipe = parseRecipe(json);
  } catch (err) {
    if (err instanceof OptionError) err.message = `${file}: ${err.message}`;
    throw err;
  }
  const m = recipeMatrix();
  await applyRecipe(m, { subjectCodes: m.subjectCodes }, recipe, quietContext);
}

/** Reads one mutant of `format`; `variant` picks among the equivalent ways in (chunking, by offset). */
export async function readAs(format: FuzzFormat, bytes: Uint8Array, variant: number): Promise<void> {
  const file = FILE_NAMES[format];
  switch (format) {
    case 'csv':
    case 'arrow':
      useTable(await pushed(format, bytes, variant));
      return;
    case 'parquet':
      // By offset (files in the app and the CLI), or pushed whole (bytes handed to the parse job).
      useTable(variant % 2 === 0 ? await readTableSource('parquet', file, bytesSource(bytes), {}, quietContext) : await pushed('parquet', bytes, 0));
      return;
    case 'edf': {
      const edf = await openEdf(bytesSource(bytes), file);
      await edf.annotations();
      const first = edf.coverage[0];
      if (first) await edf.readSpan(first.start, Math.min(first.end, first.start + 30));
      return;
    }
    case 'study': {
      const study = decodeStudy(bytes, file);
      for (const run of study.runs) runCuration(run);
      return;
    }
    case 'recipe':
      return recipeFile(bytes);
  }
}

export type Outcome = 'read' | 'refused' | 'crash' | 'unlocated' | 'allocation' | 'hang';

/** The outcome of one read, and for a finding what was thrown. */
export function classify(format: FuzzFormat, err: unknown): { outcome: Outcome; detail?: string } {
  if (err === undefined) return { outcome: 'read' };
  const file = FILE_NAMES[format];
  if (err instanceof AllocationRefused) return { outcome: 'allocation', detail: err.message };
  if (err instanceof InputError) return err.details.file === file && err.message.startsWith(file) ? { outcome: 'refused' } : { outcome: 'unlocated', detail: err.message };
  // A recipe's options are refused with OptionError naming the step and field (prefixed with the
  // file name when the JSON itself is checked; a feature list is checked when the step runs).
  if (err instanceof OptionError && format === 'recipe') return /(^fuzz-recipe\.json: )?invalid recipe/.test(err.message) ? { outcome: 'refused' } : { outcome: 'unlocated', detail: err.message };
  const e = err instanceof Error ? err : new Error(String(err));
  const at = (e.stack ?? '').split('\n').find((l) => l.trim().startsWith('at ')) ?? '';
  return { outcome: 'crash', detail: `${e.name}: ${e.message} ${at.trim()}` };
}
