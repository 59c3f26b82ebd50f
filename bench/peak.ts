import { Worker } from 'node:worker_threads';

/**
 * Samples the process's resident set size every millisecond from a worker thread, so that the
 * peak is seen even while the main thread is busy in synchronous code. The worker keeps the
 * largest value (KiB) in shared memory; `reset` and `peakMiB` read and clear it.
 */
export class PeakSampler {
  private readonly shared = new Int32Array(new SharedArrayBuffer(8));
  private readonly worker: Worker;

  constructor() {
    this.worker = new Worker(
      `const { workerData } = require('node:worker_threads');
       const peak = new Int32Array(workerData);
       setInterval(() => {
         const kib = Math.round(process.memoryUsage.rss() / 1024);
         if (kib > Atomics.load(peak, 0)) Atomics.store(peak, 0, kib);
         Atomics.store(peak, 1, 1);
       }, 1);`,
      { eval: true, workerData: this.shared.buffer },
    );
    this.worker.unref();
  }

  /** Resolves once the sampler has taken its first sample. */
  async ready(): Promise<void> {
    while (Atomics.load(this.shared, 1) === 0) await new Promise((r) => setTimeout(r, 5));
  }

  /** Starts a new measurement window; returns the current RSS in MiB. */
  reset(): number {
    const kib = Math.round(process.memoryUsage.rss() / 1024);
    Atomics.store(this.shared, 0, kib);
    return kib / 1024;
  }

  /** Largest RSS seen since the last reset, MiB. */
  peakMiB(): number {
    return Math.max(Atomics.load(this.shared, 0), Math.round(process.memoryUsage.rss() / 1024)) / 1024;
  }

  async stop(): Promise<void> {
    await this.worker.terminate();
  }
}
