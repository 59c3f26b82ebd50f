import { describe, expect, it } from 'vitest';
import { labelFirstCsv, labelFirstList } from '../../../src/core/export/label-first';
import type { Table } from '../../../src/core/table/table';
import { clusterIdentities } from '../../../src/core/export/run-model';
import { emptyNote } from '../../../src/core/curation/initial-state';
import type { ClusterNote } from '../../../src/core/curation/curation.types';

function identities(labels: Int32Array, notes: Partial<ClusterNote>[]) {
  return clusterIdentities({ state: { labels, clusters: notes.map((n) => ({ ...emptyNote(), ...n })) } });
}

describe('labelFirstList', () => {
  const labels = Int32Array.from([0, 0, 0, 0, 1, 1, 2]);
  const confidence = Float32Array.from([0.5, 0.9, 0.1, 0.9, 0.3, 0.7, 1]);

  it('lists per cluster the most confident windows as typical and the least confident as borderline, without repeats', () => {
    const rows = labelFirstList({ labels, confidence, identities: identities(labels, [{ className: 'walking' }, {}, { setAside: true }]), perKind: 2 });
    expect(rows.map((r) => [r.cluster, r.kind, r.rank, r.window])).toEqual([
      [0, 'typical', 1, 1], [0, 'typical', 2, 3], // ties by window index
      [0, 'borderline', 1, 2], [0, 'borderline', 2, 0],
      [1, 'typical', 1, 5], [1, 'typical', 2, 4],
    ]);
    expect(rows[0].className).toBe('walking');
  });

  it('keeps classes only when asked', () => {
    const rows = labelFirstList({ labels, confidence, identities: identities(labels, [{ className: 'walking' }, {}, {}]), perKind: 1, classesOnly: true });
    expect(new Set(rows.map((r) => r.cluster))).toEqual(new Set([0]));
  });

  it('writes a CSV with the windows identity and the cluster by number and name, as on screen', () => {
    const table: Table = { fileName: 'w.csv', nRows: 7, columns: [] };
    const ids = identities(labels, [{}, {}, {}]);
    const csv = labelFirstCsv(table, [], labelFirstList({ labels, confidence, identities: ids, perKind: 1 }), ids);
    expect(csv.split('\n')[0]).toBe('class_name,cluster,cluster_name,kind,rank,window_id,subject,session,start,end,confidence');
    expect(csv.split('\n')[1]).toBe(',1,candidate 1,typical,1,1,,,,,0.9');
  });
});
