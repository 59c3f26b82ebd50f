import { writeZip, type ZipEntry } from './zip';
import { arrayBytes, dtypeOf, type StudyArray } from './typed-arrays';
import type { Study } from './study.types';

/** Name of the JSON document inside the study archive. */
export const STUDY_JSON = 'study.json';

const RUN_ID = /^[A-Za-z0-9_-]{1,64}$/;

/**
 * The study as one ZIP archive (stored, see zip.ts): study.json first, then one little-endian binary
 * entry per typed array, arrays/<run id>/<path>.bin (arrays outside runs under arrays/study/). In
 * study.json each array is replaced by {"$array": entry name, "dtype", "length"}; numbers JSON cannot
 * hold (NaN, ±Infinity) by {"$number": "NaN" | "Infinity" | "-Infinity"}. Same study, same bytes.
 */
export function encodeStudy(study: Study): Uint8Array {
  const seen = new Set<string>();
  for (const run of study.runs) {
    if (!RUN_ID.test(run.id)) throw new Error(`encodeStudy: run id ${JSON.stringify(run.id)} must be 1–64 letters, digits, "-" or "_"`);
    if (seen.has(run.id)) throw new Error(`encodeStudy: run id "${run.id}" used twice`);
    seen.add(run.id);
  }
  const arrays: ZipEntry[] = [];
  const { runs, ...rest } = study;
  const json = {
    ...(lift(rest, 'study', [], arrays) as object),
    runs: runs.map((run) => lift(run, run.id, [], arrays)),
  };
  const text = `${JSON.stringify(json, null, 1)}\n`;
  return writeZip([{ name: STUDY_JSON, data: new TextEncoder().encode(text) }, ...arrays]);
}

/** A JSON-ready copy of `value` with typed arrays moved to `arrays`. */
function lift(value: unknown, scope: string, path: string[], arrays: ZipEntry[]): unknown {
  if (typeof value === 'number') {
    return Number.isFinite(value) ? value : { $number: String(value) };
  }
  if (value === null || typeof value !== 'object') return value;
  const dtype = dtypeOf(value);
  if (dtype) {
    const stem = `arrays/${scope}/${path.join('.') || 'value'}`;
    let name = `${stem}.bin`;
    // Keys that differ only in characters left out of names get a numbered entry each.
    for (let n = 2; arrays.some((e) => e.name === name); n++) name = `${stem}~${n}.bin`;
    arrays.push({ name, data: arrayBytes(value as StudyArray) });
    return { $array: name, dtype, length: (value as StudyArray).length };
  }
  if (ArrayBuffer.isView(value)) throw new Error(`encodeStudy: unsupported array type at ${path.join('.')}`);
  if (Array.isArray(value)) return value.map((v, i) => lift(v, scope, [...path, String(i)], arrays));
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) {
    if (v !== undefined) out[key] = lift(v, scope, [...path, key.replace(/[^A-Za-z0-9_-]/g, '_')], arrays);
  }
  return out;
}
