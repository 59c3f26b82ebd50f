import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

setFlagsFromString('--expose_gc');
const gc = runInNewContext('gc') as () => void;

export interface Measurement<T> {
  /** Median wall time over the runs, ms. */
  ms: number;
  /** Largest growth of heap + array buffers seen right after a run (before any forced GC), MB. */
  memMB: number;
  /** The last run's result. */
  result: T;
}

function used(): number {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
}

/** Runs `fn` once to warm up, then `runs` times after a forced GC each; median time, largest memory growth. */
export async function measure<T>(fn: () => T | Promise<T>, runs = 3): Promise<Measurement<T>> {
  const times: number[] = [];
  let mem = 0;
  let result: T | undefined = await fn(); // warm-up, untimed
  for (let r = 0; r < runs; r++) {
    gc();
    const before = used();
    const t0 = performance.now();
    result = await fn();
    times.push(performance.now() - t0);
    mem = Math.max(mem, used() - before);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)], memMB: mem / 2 ** 20, result: result as T };
}
