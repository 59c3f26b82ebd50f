// Mutations that keep a file's outer layer valid so that the checks behind it are reached: a
// recipe's JSON stays JSON with one value changed, and a study's ZIP stays a ZIP (CRCs right) with
// study.json or one array entry changed. Seeded as mutate.ts is.
import { seededRandom, type Random } from '../../src/core/random';
import { readZip, writeZip } from '../../src/core/study/zip';
import { mutant } from './mutate';

const EDGE_VALUES: unknown[] = [null, true, false, 0, -1, 1, 0.5, -0.5, 1e308, -1e308, 2 ** 31, 2 ** 53, -(2 ** 31), 1e-320, '', 'x', 'NaN', '-1', [], [0], [null], {}, { type: 'zscore' }, { $number: 'NaN' }, { $number: 'Infinity' }, { $array: 'arrays/none.bin', dtype: 'int32', length: 3 }, { $array: 'arrays/run-1/result.labels.bin', dtype: 'float64', length: 1e9 }];

const int = (random: Random, n: number) => Math.floor(random() * n);
/** A fresh copy of an edge value, so that later edits never make the JSON circular. */
const edge = (random: Random) => structuredClone(EDGE_VALUES[int(random, EDGE_VALUES.length)]);

/** Every container (object or array) in a JSON value, with the keys it holds. */
function containers(v: unknown, out: (Record<string, unknown> | unknown[])[] = []): (Record<string, unknown> | unknown[])[] {
  if (v !== null && typeof v === 'object') {
    out.push(v as Record<string, unknown>);
    for (const child of Object.values(v)) containers(child, out);
  }
  return out;
}

/** One to three edits of a JSON value: a value replaced by an edge value, a key deleted, or an array entry duplicated. */
export function mutateJson(json: unknown, random: Random): unknown {
  const copy = JSON.parse(JSON.stringify(json)) as unknown;
  for (let k = 1 + int(random, 3); k > 0; k--) {
    const all = containers(copy);
    if (all.length === 0) return edge(random);
    const c = all[int(random, all.length)];
    const keys = Object.keys(c);
    if (keys.length === 0) continue;
    const key = keys[int(random, keys.length)];
    const r = random();
    if (r < 0.7) (c as Record<string, unknown>)[key] = edge(random);
    else if (r < 0.85 && !Array.isArray(c)) delete (c as Record<string, unknown>)[key];
    else if (Array.isArray(c)) c.splice(int(random, c.length + 1), 0, structuredClone(c[Number(key)]));
    else (c as Record<string, unknown>)[`${key}_extra`] = structuredClone(c[key as keyof typeof c]);
  }
  return copy;
}

const text = (b: Uint8Array) => new TextDecoder().decode(b);
const bytes = (s: string) => new TextEncoder().encode(s);

/** A recipe file with one to three values of its JSON changed. */
export function recipeMutant(seeds: readonly Uint8Array[], campaignSeed: number, index: number): Uint8Array {
  const random = seededRandom((campaignSeed * 7_000_003 + index) >>> 0);
  return bytes(JSON.stringify(mutateJson(JSON.parse(text(seeds[int(random, seeds.length)])), random)));
}

/** A study with study.json edited as JSON, or one array entry's bytes mutated, then zipped again. */
export function studyMutant(seeds: readonly Uint8Array[], campaignSeed: number, index: number): Uint8Array {
  const random = seededRandom((campaignSeed * 7_000_003 + index) >>> 0);
  const entries = readZip(seeds[int(random, seeds.length)]);
  const at = random() < 0.6 ? 0 : int(random, entries.length);
  const entry = entries[at];
  const data = entry.name.endsWith('.json')
    ? bytes(JSON.stringify(mutateJson(JSON.parse(text(entry.data)), random)))
    : mutant([entry.data], campaignSeed * 31 + 7, index).bytes;
  return writeZip(entries.map((e, i) => (i === at ? { name: e.name, data } : e)));
}
