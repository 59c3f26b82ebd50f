/**
 * Writes the invented "Home routines" demo study (see README.md): a featurized windows table, the
 * generator's truth, and optionally the raw signals. Deterministic: same seed, same bytes.
 *
 *   node --import tsx demo-data/generate.ts [--raw] [--out <dir>] [--seed <integer>]
 */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { OptionError } from '../src/core/errors';
import { seededRandom } from '../src/core/random';
import { rawEdf } from './sim/edf';
import { simulateVolunteer, type SimulatedRecording } from './sim/simulate';
import { labelledWindows, rawCsv, truthCsv, windowsCsv, windowsOf, type WindowRow } from './sim/tables';
import { makeVolunteer, VOLUNTEER_COUNT } from './sim/volunteers';

export const DEFAULT_SEED = 20260302;
export const DEMO_DIR = dirname(fileURLToPath(import.meta.url));

export interface GenerateOptions {
  /** Output folder (default: this folder). */
  outDir?: string;
  /** Also write raw/Sxx.csv and raw/Sxx.edf (EDF+ with activity annotations) per volunteer. */
  raw?: boolean;
  seed?: number;
}

export interface GenerateSummary {
  windows: number;
  subjects: number;
  files: string[];
}

/** Write `text` to `path` atomically: a temporary file beside it, then a rename. */
export function writeAtomic(path: string, text: string | Uint8Array): void {
  const tmp = `${path}.${process.pid}.tmp`;
  writeFileSync(tmp, text);
  renameSync(tmp, path);
}

/** The volunteers' simulated recordings, one at a time (each is ~10 MB of samples). */
export function* simulateStudy(seed: number): Generator<SimulatedRecording> {
  const people = seededRandom(seed);
  for (let i = 0; i < VOLUNTEER_COUNT; i++) {
    const volunteer = makeVolunteer(i, people);
    yield simulateVolunteer(volunteer, seededRandom(seed + 1009 * (i + 1)));
  }
}

export function generateDemoStudy(options: GenerateOptions = {}): GenerateSummary {
  const outDir = options.outDir ?? DEMO_DIR;
  const seed = options.seed ?? DEFAULT_SEED;
  if (!Number.isSafeInteger(seed)) throw new OptionError('seed', seed, 'an integer');
  mkdirSync(outDir, { recursive: true });
  if (options.raw) mkdirSync(join(outDir, 'raw'), { recursive: true });
  const files: string[] = [];
  const rows: WindowRow[] = [];
  for (const rec of simulateStudy(seed)) {
    rows.push(...windowsOf(rec));
    if (options.raw) {
      const path = join(outDir, 'raw', `${rec.volunteer.id}.csv`);
      writeAtomic(path, rawCsv(rec));
      const edfPath = join(outDir, 'raw', `${rec.volunteer.id}.edf`);
      writeAtomic(edfPath, rawEdf(rec));
      files.push(path, edfPath);
    }
  }
  const labelled = labelledWindows(rows.length, seed + 7);
  const windowsPath = join(outDir, 'windows.csv');
  const truthPath = join(outDir, 'truth.csv');
  writeAtomic(windowsPath, windowsCsv(rows, labelled));
  writeAtomic(truthPath, truthCsv(rows));
  files.push(windowsPath, truthPath);
  return { windows: rows.length, subjects: VOLUNTEER_COUNT, files };
}

export function parseArgs(argv: readonly string[]): GenerateOptions {
  const options: GenerateOptions = {};
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--raw') options.raw = true;
    else if (arg === '--out' || arg === '--seed') {
      const value = argv[++i];
      if (value === undefined || value.startsWith('--')) throw new OptionError(arg, value ?? null, 'a value after the flag');
      if (arg === '--out') options.outDir = value;
      else {
        const seed = Number(value);
        if (!Number.isSafeInteger(seed)) throw new OptionError('--seed', value, 'an integer');
        options.seed = seed;
      }
    } else throw new OptionError('argument', arg, '--raw, --out <dir> or --seed <integer>');
  }
  return options;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  try {
    const summary = generateDemoStudy(parseArgs(process.argv.slice(2)));
    console.log(`demo-data: ${summary.windows} windows from ${summary.subjects} volunteers`);
    for (const f of summary.files) console.log(`  wrote ${f}`);
  } catch (e) {
    console.error(e instanceof Error ? e.message : e);
    process.exitCode = 1;
  }
}
