import { describe, expect, it } from 'vitest';
import { buildLogTable, tableAt } from '../../../../src/core/embed/umap/log-table';

describe('log-spaced lookup table', () => {
  it('reads a power law to 2e-5 relative error inside the grid and signals −1 outside', () => {
    const a = 1.576943460405378;
    const b = 0.8950608781227859;
    const f = (x: number) => (2 * b) / ((0.001 + x) * (a * Math.pow(x, b) + 1));
    const table = buildLogTable(f);
    let worst = 0;
    for (let i = 0; i <= 10_000; i++) {
      const x = Math.exp(-25 + (50 * i) / 10_000);
      worst = Math.max(worst, Math.abs(tableAt(table, x) / f(x) - 1));
    }
    expect(worst).toBeLessThan(2e-5);
    expect(tableAt(table, 1e-15)).toBe(-1);
    expect(tableAt(table, 1e15)).toBe(-1);
  });
});
