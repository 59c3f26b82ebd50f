import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { afterEach, describe, expect, it } from 'vitest';
import { CancelledError, InputError } from '../../src/core/errors';
import type { JobContext } from '../../src/core/job';
import { JobClient, type Progress } from '../../src/worker/client';
import { serveJobs, type JobHandler } from '../../src/worker/host';
import type { FromHost, MessagePortLike, ToHost } from '../../src/worker/protocol';

/** Wraps one end of a Node MessageChannel in the shape the job protocol uses. */
function portLike<In, Out>(port: MessagePort): MessagePortLike<In, Out> {
  return {
    post: (message, transfer) => port.postMessage(message, (transfer ?? []) as ArrayBuffer[]),
    listen: (handler) => port.on('message', (m: In) => handler(m)),
  };
}

const testJobs = {
  /** Squares 0..n-1 into a Float64Array, reporting progress every step. */
  async squares(payload: { n: number }, ctx: JobContext) {
    const out = new Float64Array(payload.n);
    for (let i = 0; i < payload.n; i++) {
      out[i] = i * i;
      ctx.progress('squaring', (i + 1) / payload.n);
      await ctx.checkpoint();
      await new Promise((r) => setTimeout(r, 2));
    }
    return { values: out, n: payload.n };
  },
  /** Sums the bytes it was sent (the payload's buffer arrives transferred). */
  async sum(payload: { bytes: Uint8Array }) {
    let s = 0;
    for (const b of payload.bytes) s += b;
    return { sum: s };
  },
  /** Offers a partial layout on every step for ~600 ms; the host keeps a few per second. */
  async layouts(_payload: unknown, ctx: JobContext) {
    const t0 = performance.now();
    let offered = 0;
    while (performance.now() - t0 < 600) {
      offered++;
      if (ctx.wantsPartial?.()) ctx.partial?.({ coords: new Float32Array([offered, offered]) });
      await new Promise((r) => setTimeout(r, 5));
      await ctx.checkpoint();
    }
    return { offered };
  },
  async badInput(_payload: unknown) {
    throw new InputError({ file: 'w.csv', row: 3, column: 'acc_x_mean', expected: 'a number', found: 'abc' });
  },
  async broken(_payload: unknown) {
    throw new RangeError('something broke');
  },
  /** Loops on checkpoints until cancelled (or a safety cap, so a broken cancel fails the test). */
  async spin(_payload: unknown, ctx: JobContext) {
    for (let i = 0; i < 5_000_000; i++) {
      ctx.progress('spinning', i / 5_000_000);
      await ctx.checkpoint();
    }
    return { finished: true };
  },
} satisfies Record<string, JobHandler>;

const channels: MessageChannel[] = [];

function setup(): JobClient<typeof testJobs> {
  const channel = new MessageChannel();
  channels.push(channel);
  serveJobs(portLike<ToHost, FromHost>(channel.port2), testJobs, () => performance.now());
  return new JobClient<typeof testJobs>(portLike<FromHost, ToHost>(channel.port1));
}

afterEach(() => {
  for (const c of channels.splice(0)) {
    c.port1.close();
    c.port2.close();
  }
});

describe('serveJobs + JobClient over a Node MessageChannel', () => {
  it('delivers progress events and the result, typed arrays intact', async () => {
    const client = setup();
    const events: Progress[] = [];
    const job = client.run('squares', { n: 40 }, { onProgress: (p) => events.push(p) });
    const result = await job.result;
    expect(result.values).toBeInstanceOf(Float64Array);
    expect(Array.from(result.values.slice(0, 5))).toEqual([0, 1, 4, 9, 16]);
    expect(result.values[39]).toBe(39 * 39);
    expect(events.length).toBeGreaterThan(0);
    expect(events.every((e) => e.stage === 'squaring' && e.fraction >= 0 && e.fraction <= 1)).toBe(true);
    // The last progress always goes through, whatever the throttle.
    expect(events[events.length - 1].fraction).toBe(1);
  });

  it('names every stage: the first report of a new stage goes through the throttle, with its detail', async () => {
    // A clock that stands still: every report after the first falls inside the throttle's 100 ms.
    const channel = new MessageChannel();
    channels.push(channel);
    const staged = {
      async staged(_payload: unknown, ctx: JobContext) {
        ctx.progress('embedding', 0.1, 'UMAP · epoch 198 / 200');
        ctx.progress('embedding', 0.2, 'UMAP · epoch 199 / 200');
        ctx.progress('placing', 0.3, '0 / 5,000 windows');
        ctx.progress('placing', 0.4, '2,000 / 5,000 windows');
        ctx.progress('quality', 0.5);
        ctx.progress('quality', 0.6);
        return {};
      },
    } satisfies Record<string, JobHandler>;
    serveJobs(portLike<ToHost, FromHost>(channel.port2), staged, () => 1000);
    const client = new JobClient<typeof staged>(portLike<FromHost, ToHost>(channel.port1));
    const events: Progress[] = [];
    await client.run('staged', {}, { onProgress: (p) => events.push(p) }).result;
    expect(events).toEqual([
      { stage: 'embedding', fraction: 0.1, detail: 'UMAP · epoch 198 / 200' },
      { stage: 'placing', fraction: 0.3, detail: '0 / 5,000 windows' },
      { stage: 'quality', fraction: 0.5 },
    ]);
  });

  it('transfers payload buffers instead of copying them', async () => {
    const client = setup();
    const bytes = new Uint8Array([1, 2, 3, 250]);
    const job = client.run('sum', { bytes }, { transfer: [bytes.buffer] });
    // A transferred buffer is detached on the sending side.
    expect(bytes.byteLength).toBe(0);
    expect((await job.result).sum).toBe(256);
  });

  it('transfers result typed arrays from the host', async () => {
    const channel = new MessageChannel();
    channels.push(channel);
    let sent: Float64Array | undefined;
    serveJobs(portLike<ToHost, FromHost>(channel.port2), {
      async make() {
        sent = new Float64Array([1, 2, 3]);
        return { values: sent };
      },
    }, () => performance.now());
    const client = new JobClient(portLike<FromHost, ToHost>(channel.port1));
    const result = (await client.run('make', {}).result) as { values: Float64Array };
    expect(Array.from(result.values)).toEqual([1, 2, 3]);
    expect(sent?.byteLength).toBe(0);
  });

  it('turns an InputError thrown in a job into an InputError with its details', async () => {
    const client = setup();
    const err = await client.run('badInput', {}).result.catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InputError);
    const e = err as InputError;
    expect(e.details).toEqual({ file: 'w.csv', row: 3, column: 'acc_x_mean', expected: 'a number', found: 'abc' });
    expect(e.message).toBe('w.csv, row 3, column "acc_x_mean": expected a number, found "abc"');
  });

  it('passes other errors on by name and message', async () => {
    const client = setup();
    const err = (await client.run('broken', {}).result.catch((e: unknown) => e)) as Error;
    expect(err).toBeInstanceOf(Error);
    expect(err.name).toBe('RangeError');
    expect(err.message).toBe('something broke');
  });

  it('rejects with CancelledError promptly when a long job is cancelled', async () => {
    const client = setup();
    let sawProgress!: () => void;
    const started = new Promise<void>((r) => (sawProgress = r));
    const job = client.run('spin', {}, { onProgress: () => sawProgress() });
    await started;
    job.cancel();
    // "Promptly": within a few of the host's 30 ms slices, far below the job's natural length.
    // A fake-timer-free bound: the cancel must win a race against a 2 s timer.
    const outcome = await Promise.race([
      job.result.then(() => 'finished', (e: unknown) => e),
      new Promise((r) => setTimeout(() => r('timeout'), 2000)),
    ]);
    expect(outcome).toBeInstanceOf(CancelledError);
  });

  it('keeps other jobs running when one is cancelled', async () => {
    const client = setup();
    const spin = client.run('spin', {});
    const squares = client.run('squares', { n: 5 });
    spin.cancel();
    await expect(spin.result).rejects.toBeInstanceOf(CancelledError);
    expect((await squares.result).n).toBe(5);
  });

  it('rejects a job name the host does not serve', async () => {
    // An untyped client (any job name) against the typed host.
    const client = setup() as unknown as JobClient;
    await expect(client.run('noSuchJob', {}).result).rejects.toThrow('unknown job "noSuchJob"');
  });

  it('delivers a few partial results per second, typed arrays intact, before the result', async () => {
    const client = setup();
    const partials: Float32Array[] = [];
    const job = client.run('layouts', {}, { onPartial: (v) => partials.push((v as { coords: Float32Array }).coords) });
    const { offered } = await job.result;
    // The host throttles to one partial per 250 ms: over ~600 ms that is 2 or 3, far fewer than offered.
    expect(partials.length).toBeGreaterThanOrEqual(2);
    expect(partials.length).toBeLessThanOrEqual(4);
    expect(offered).toBeGreaterThan(partials.length * 5);
    for (const p of partials) expect(p).toBeInstanceOf(Float32Array);
  });
});
