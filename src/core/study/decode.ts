import { replay } from '../curation/history';
import { initialCuration } from '../curation/initial-state';
import { InputError } from '../errors';
import { migrateStudy } from './migrate';
import { readZip } from './zip';
import { STUDY_JSON } from './encode';
import { arrayFromBytes, DTYPES, type Dtype } from './typed-arrays';
import type { Study } from './study.types';

/**
 * Reads a study archive written by encodeStudy (or an older version of it): checks the archive and
 * every entry's CRC, migrates study.json to the current schema and puts the typed arrays back in
 * place. Throws InputError naming the file and what was expected.
 */
export function decodeStudy(bytes: Uint8Array, fileName: string): Study {
  const fail = (expected: string, found?: string): never => {
    throw new InputError({ file: fileName, expected, ...(found !== undefined ? { found } : {}) });
  };
  let entries;
  try {
    entries = readZip(bytes);
  } catch (err) {
    return fail(`a Gleaner study (a ZIP archive): ${(err as Error).message}`);
  }
  const byName = new Map(entries.map((e) => [e.name, e.data]));
  const jsonBytes = byName.get(STUDY_JSON);
  if (!jsonBytes) return fail(`a Gleaner study with ${STUDY_JSON} inside`, entries.map((e) => e.name).slice(0, 5).join(', '));
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(jsonBytes));
  } catch (err) {
    return fail(`${STUDY_JSON} in JSON`, (err as Error).message);
  }
  let doc: Record<string, unknown>;
  try {
    doc = migrateStudy(json);
  } catch (err) {
    return fail(`${STUDY_JSON}: ${(err as Error).message}`);
  }
  const study = restore(doc, byName, fail) as Study;
  checkShape(study, fail);
  return study;
}

function restore(value: unknown, entries: Map<string, Uint8Array>, fail: (e: string, f?: string) => never): unknown {
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map((v) => restore(v, entries, fail));
  const obj = value as Record<string, unknown>;
  if (typeof obj.$number === 'string' && Object.keys(obj).length === 1) {
    const n = Number(obj.$number);
    return Number.isNaN(n) && obj.$number !== 'NaN' ? fail('"$number" of NaN, Infinity or -Infinity', obj.$number) : n;
  }
  if (typeof obj.$array === 'string') {
    const { $array: name, dtype, length } = obj as { $array: string; dtype: unknown; length: unknown };
    if (typeof dtype !== 'string' || !(dtype in DTYPES)) return fail(`a known dtype for ${name} (${Object.keys(DTYPES).join(', ')})`, String(dtype));
    if (typeof length !== 'number' || !Number.isInteger(length) || length < 0) return fail(`an integer length for ${name}`, String(length));
    const data = entries.get(name);
    if (!data) return fail(`the entry ${name} named in ${STUDY_JSON}`, 'no such entry');
    const array = arrayFromBytes(dtype as Dtype, data, length);
    return array ?? fail(`${name} to hold ${length} ${dtype} values`, `${data.length} bytes`);
  }
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(obj)) out[k] = restore(v, entries, fail);
  return out;
}

function checkShape(s: Study, fail: (e: string, f?: string) => never): void {
  if (!Array.isArray(s.inputs)) fail(`${STUDY_JSON} with an "inputs" list`);
  for (const [i, input] of s.inputs.entries()) {
    if (typeof input?.sha256 !== 'string' || typeof input.fileName !== 'string') fail(`inputs[${i}] with fileName and sha256`);
  }
  if (!Array.isArray(s.runs)) fail(`${STUDY_JSON} with a "runs" list`);
  for (const [i, run] of s.runs.entries()) {
    const where = `runs[${i}]`;
    if (typeof run?.id !== 'string') fail(`${where} with an id`);
    if (!Number.isInteger(run.input) || run.input < 0 || run.input >= s.inputs.length) fail(`${where}.input to name one of the ${s.inputs.length} inputs`, String(run.input));
    if (!(run.result?.labels instanceof Int32Array)) fail(`${where}.result.labels as an int32 array`);
    const k = run.result.cluster?.k;
    if (!Number.isInteger(k) || k < 1 || k > Math.max(1, run.result.labels.length)) fail(`${where}.result.cluster.k from 1 to the ${run.result.labels.length} windows`, String(k));
    if (!Array.isArray(run.curation?.actions)) fail(`${where}.curation.actions as a list`);
    run.curation.undone ??= [];
    run.flags ??= [];
    if (!Array.isArray(run.curation.undone)) fail(`${where}.curation.undone as a list`);
    // The recorded actions, then the undone ones as redo would apply them, must fit the run's
    // clusters and windows: reopening replays them (the app keeps redo working the same way).
    try {
      replay(initialCuration(run.result.labels, run.result.cluster?.k, run.result.cluster), [...run.curation.actions, ...[...run.curation.undone].reverse()]);
    } catch (err) {
      fail(`${where}.curation: recorded actions that fit the run's clusters and windows`, err instanceof Error ? err.message : String(err));
    }
  }
  s.notes ??= '';
  s.view ??= {};
}
