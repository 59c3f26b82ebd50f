// One fuzzing process: `node --import tsx test/fuzz/child.ts <format> <campaign seed> <from> <to> <allocation limit>`
// reads mutants from..to-1 of one format and prints, per mutant, ">i" when it starts and "=i outcome"
// when it ends, with "!i outcome detail" before that for a finding. campaign.ts watches the lines:
// a mutant that does not end within the time bound is a hang, and the process is killed. Mutants
// are bytes changed (mutate.ts); for the study and recipe every other one is a structured edit.
import './guard-first';
import { mkdtempSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mutant } from './mutate';
import { recipeMutant, studyMutant } from './structured';
import { FORMATS, seedsFor, type FuzzFormat } from './seeds';
import { classify, readAs } from './targets';

const [format, campaignSeed, from, to] = process.argv.slice(2);
if (!(FORMATS as readonly string[]).includes(format)) throw new Error(`unknown format ${format}`);
const fmt = format as FuzzFormat;

const dir = mkdtempSync(join(tmpdir(), 'gleaner-fuzz-seeds-'));
let seeds: Uint8Array[];
try {
  seeds = await seedsFor(fmt, dir);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
// Every seed must be read: a fuzzer whose starting points are refused tests little.
for (const [k, s] of seeds.entries()) {
  for (const variant of [0, 1]) {
    let err: unknown;
    await readAs(fmt, s, variant).catch((e: unknown) => { err = e ?? new Error('rejected'); });
    if (err !== undefined) throw new Error(`seed ${k} of ${fmt} is not read: ${err instanceof Error ? err.message : String(err)}`);
  }
}

// Written synchronously, waiting while the pipe is full: ">i" must be out before mutant i is read,
// and process.stdout would queue lines while the mutants' promises never leave the microtask queue.
const pause = new Int32Array(new SharedArrayBuffer(4));
const out = (line: string) => {
  const bytes = Buffer.from(`${line}\n`);
  for (let at = 0; at < bytes.length;) {
    try {
      at += writeSync(1, bytes, at);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EAGAIN') throw err;
      Atomics.wait(pause, 0, 0, 1);
    }
  }
};
/** Odd mutants of the study and recipe keep the ZIP and JSON valid (structured.ts), so the checks behind them are reached. */
function next(i: number) {
  const structured = i % 2 === 1 && (fmt === 'study' || fmt === 'recipe');
  if (!structured) return mutant(seeds, Number(campaignSeed), i);
  const bytes = fmt === 'study' ? studyMutant(seeds, Number(campaignSeed), i) : recipeMutant(seeds, Number(campaignSeed), i);
  return { bytes, seed: -1, applied: ['structured'] };
}

for (let i = Number(from); i < Number(to); i++) {
  const m = next(i);
  out(`>${i}`);
  let err: unknown;
  await readAs(fmt, m.bytes, i).catch((e: unknown) => { err = e ?? new Error('rejected without a reason'); });
  const { outcome, detail } = classify(fmt, err);
  if (detail !== undefined) out(`!${i} ${outcome} ${JSON.stringify({ seed: m.seed, mutations: m.applied, bytes: m.bytes.length, detail })}`);
  out(`=${i} ${outcome}`);
}
