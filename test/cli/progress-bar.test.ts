import { describe, expect, it } from 'vitest';
import { progressReporter } from '../../src/cli/progress-bar';

/** A stream that keeps what is written (the reporter writes text only). */
function sink(isTTY: boolean): NodeJS.WriteStream & { text: string } {
  const s = { text: '', isTTY, columns: 200, write(chunk: string) { s.text += chunk; return true; } };
  return s as unknown as NodeJS.WriteStream & { text: string };
}

describe('progressReporter', () => {
  it('lines: each new stage on a line of its own, with its detail and the elapsed time; no stale detail', () => {
    let t = 0;
    const out = sink(false);
    const bar = progressReporter(out, 'lines', () => t);
    bar.update('r1: embedding', 0.1, 'UMAP · epoch 198 / 200');
    t = 3000;
    bar.update('r1: placing', 0.5, '0 / 5,000 windows');
    t = 4000;
    bar.update('r1: quality', 0.9);
    bar.finish();
    expect(out.text.split('\n')).toEqual([
      'gleaner: 10% r1: embedding · UMAP · epoch 198 / 200 · 0 s elapsed',
      'gleaner: 50% r1: placing · 0 / 5,000 windows · 3 s elapsed',
      'gleaner: 90% r1: quality · 4 s elapsed',
      '',
    ]);
  });

  it('lines: a steady job shows the time left once the estimate is stable', () => {
    let t = 0;
    const out = sink(false);
    const bar = progressReporter(out, 'lines', () => t);
    // 100 s in all, reports every 100 ms; a line every 2 s.
    for (t = 0; t <= 30_000; t += 100) bar.update('sweep: k = 4', t / 100_000);
    bar.finish();
    const lines = out.text.trim().split('\n');
    expect(lines[0]).toBe('gleaner: 0% sweep: k = 4 · 0 s elapsed');
    expect(lines.slice(0, 2).some((l) => l.includes('left'))).toBe(false);
    expect(lines[lines.length - 1]).toBe('gleaner: 30% sweep: k = 4 · 30 s elapsed · about 1 min 10 s left');
  });

  it('bar: the stage words follow the bar; finish clears the line', () => {
    const out = sink(true);
    const bar = progressReporter(out, 'bar', () => 0);
    bar.update('reading', 0.25, '3.0 of 12.0 MiB');
    bar.finish();
    expect(out.text).toBe('\r\x1b[K[#######.....................]  25% reading · 3.0 of 12.0 MiB · 0 s elapsed\r\x1b[K');
  });
});
