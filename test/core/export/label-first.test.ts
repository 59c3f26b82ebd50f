import { describe, expect, it } from 'vitest';
import { labelFirstCsv, labelFirstList } from '../../../src/core/export/label-first';
import type { Table } from '../../../src/core/table/table';

describe('labelFirstList', () => {
  const labels = Int32Array.from([0, 0, 0, 0, 1, 1, 2]);
  const confidence = Float32Array.from([0.5, 0.9, 0.1, 0.9, 0.3, 0.7, 1]);

  it('lists per cluster the most confident windows as typical and the least confident as borderline, without repeats', () => {
    const rows = labelFirstList({ labels, confidence, classNames: ['walking', '', ''], setAside: [false, false, true], perKind: 2 });
    expect(rows.map((r) => [r.cluster, r.kind, r.rank, r.window])).toEqual([
      [0, 'typical', 1, 1], [0, 'typical', 2, 3], // ties by window index
      [0, 'borderline', 1, 2], [0, 'borderline', 2, 0],
      [1, 'typical', 1, 5], [1, 'typical', 2, 4],
    ]);
    expect(rows[0].className).toBe('walking');
  });

  it('keeps classes only when asked', () => {
    const rows = labelFirstList({ labels, confidence, classNames: ['walking'], perKind: 1, classesOnly: true });
    expect(new Set(rows.map((r) => r.cluster))).toEqual(new Set([0]));
  });

  it('writes a CSV with the windows identity', () => {
    const table: Table = { fileName: 'w.csv', nRows: 7, columns: [] };
    const csv = labelFirstCsv(table, [], labelFirstList({ labels, confidence, classNames: [], perKind: 1 }));
    expect(csv.split('\n')[1]).toBe(',0,typical,1,1,,,,,0.9');
  });
});
