import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { PeakSampler } from './peak';

setFlagsFromString('--expose_gc');
const gc = runInNewContext('gc') as () => void;

export interface Measurement<T> {
  /** Median wall time over the runs, ms. */
  ms: number;
  /** Largest rise of the process's resident set above its level at the start of a run, MiB. */
  peakMiB: number;
  /** The last run's result. */
  result: T;
}

let sampler: PeakSampler | null = null;

async function getSampler(): Promise<PeakSampler> {
  if (!sampler) {
    sampler = new PeakSampler();
    await sampler.ready();
  }
  return sampler;
}

/**
 * Runs `fn` once to warm up, then `runs` times after a forced GC each: median wall time and the
 * largest peak RSS rise seen (sampled every millisecond from a worker thread).
 */
export async function measure<T>(fn: () => T | Promise<T>, runs = 3): Promise<Measurement<T>> {
  const s = await getSampler();
  const times: number[] = [];
  let peak = 0;
  let result: T | undefined = await fn(); // warm-up, untimed
  for (let r = 0; r < runs; r++) {
    // eslint-disable-next-line no-useless-assignment -- drop the previous result so gc() can free it
    result = undefined; // let the previous result be collected before the next run
    gc();
    const base = s.reset();
    const t0 = performance.now();
    result = await fn();
    times.push(performance.now() - t0);
    peak = Math.max(peak, s.peakMiB() - base);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)], peakMiB: peak, result: result as T };
}

export async function stopMeasuring(): Promise<void> {
  await sampler?.stop();
  sampler = null;
}
