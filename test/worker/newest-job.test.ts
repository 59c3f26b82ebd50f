import { describe, expect, it } from 'vitest';
import type { RunningJob } from '../../src/worker/client';
import { NewestJob } from '../../src/worker/newest-job';

function job(id: number, cancels: number[]): RunningJob<number> {
  return { id, result: Promise.resolve(id), cancel: () => cancels.push(id) };
}

describe('NewestJob', () => {
  it('keeps the job started last: an older one is no longer newest, ends without tidying, and cancel() stops the newest', () => {
    const cancels: number[] = [];
    const newest = new NewestJob<number>();
    const a = newest.start(job(1, cancels));
    const b = newest.start(job(2, cancels));
    expect(newest.isNewest(a)).toBe(false);
    expect(newest.isNewest(b)).toBe(true);
    expect(newest.end(a)).toBe(false);
    newest.cancel();
    expect(cancels).toEqual([2]);
    expect(newest.end(b)).toBe(true);
    expect(newest.isNewest(b)).toBe(false);
    newest.start(job(3, cancels));
    newest.clear();
    expect(cancels).toEqual([2, 3]);
  });
});
