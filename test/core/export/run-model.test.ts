import { describe, expect, it } from 'vitest';
import { applyAction } from '../../../src/core/curation/apply-action';
import { initialCuration } from '../../../src/core/curation/initial-state';
import { clusterIdentities, exportedClusterRecord } from '../../../src/core/export/run-model';
import type { Roles } from '../../../src/core/table/roles.types';
import type { Column, Table } from '../../../src/core/table/table';

function text(name: string, values: string[]): Column {
  const dictionary = [...new Set(values)];
  return { kind: 'categorical', name, dictionary, codes: Int32Array.from(values, (v) => dictionary.indexOf(v)) };
}

// 80 windows, 4 subjects with 20 each. Cluster index 0 (40 windows) spreads over all four subjects
// evenly; index 1 (20 windows) is all S4; index 2 (20 windows) is S1–S3 with 10/5/5.
const subjects: string[] = [];
const labels: number[] = [];
for (let i = 0; i < 40; i++) { subjects.push(`S${(i % 4) + 1}`); labels.push(0); }
for (let i = 0; i < 20; i++) { subjects.push('S4'); labels.push(1); }
for (let i = 0; i < 20; i++) { subjects.push(i < 10 ? 'S1' : i < 15 ? 'S2' : 'S3'); labels.push(2); }
// A site column: index 1 and 2 are both at one site each; the id-like column has 80 values.
const site = labels.map((c) => (c === 0 ? ['A', 'B'][subjects.length % 2] : c === 1 ? 'B' : 'A'));
const table: Table = {
  fileName: 'w.csv', nRows: 80,
  columns: [text('pid', subjects), text('site', site), text('visit', labels.map((_, i) => `v${i}`))],
};
const roles: Roles = [
  { name: 'pid', role: 'subject', evidence: '' },
  { name: 'site', role: 'metadata', evidence: '' },
  { name: 'visit', role: 'metadata', evidence: '' },
];
const state0 = initialCuration(Int32Array.from(labels), 3);

describe('clusterIdentities', () => {
  it('numbers clusters index + 1 and names them class, else working name, else "candidate N"', () => {
    let s = applyAction(state0, { type: 'promote', cluster: 0, className: 'walking' });
    s = applyAction(s, { type: 'name', cluster: 2, name: 'loose strap?' });
    const ids = clusterIdentities({ state: s });
    expect(ids.map((i) => [i.number, i.name, i.className, i.size])).toEqual([
      [1, 'walking', 'walking', 40], [2, 'candidate 2', '', 20], [3, 'loose strap?', '', 20],
    ]);
  });

  it('flags the cluster one subject holds, with the rule\'s reason, and only that one', () => {
    // The cohort holds S1 20, S2 15, S3 15, S4 30 of 80 windows: entropy 1.3421, exp = 3.83 effective
    // subjects. Index 1 is all S4: 1 effective subject, 1/3.83 = 26% ≤ 35% (the default rule) →
    // subject-bound. Index 2: shares 1/2, 1/4, 1/4 → exp(1.0397) = 2.83 effective, 74% > 35% → not
    // flagged. (Entropies computed by hand.)
    const ids = clusterIdentities({ state: state0, table, roles });
    const subjectFlags = ids.map((i) => i.flags.filter((f) => f.role === 'subject').map((f) => f.text));
    expect(subjectFlags).toEqual([[], ['subject-bound'], []]);
    expect(ids[1].flags[0].reason).toMatch(/1\.0 effective subjects against 3\.8 in the cohort \(26% ≤ 35%\); subject S4 holds 100% of its 20 windows/);
  });

  it('judges metadata columns of 2–50 values under their own name, and leaves wider ones alone', () => {
    const ids = clusterIdentities({ state: state0, table, roles });
    const cols = new Set(ids.flatMap((i) => i.flags.map((f) => f.column)));
    expect(cols.has('visit')).toBe(false); // 80 distinct values: an identifier, not a grouping
    // The site column has 2 values with cohort effective values ~2; index 1 (all B) and 2 (all A)
    // have 1 effective value: 1/2 = 50% > 35%, so not flagged under the default rule.
    expect(ids.some((i) => i.flags.some((f) => f.column === 'site'))).toBe(false);
    const strict = clusterIdentities({ state: state0, table, roles, rule: { maxEffectiveShare: 0.6 } });
    expect(strict[1].flags.map((f) => f.text)).toContain('site-bound');
  });

  it('follows the curation: a merge empties the merged cluster and the flags are judged on the curated labels', () => {
    const merged = applyAction(state0, { type: 'merge', into: 0, from: [1] });
    const ids = clusterIdentities({ state: merged, table, roles });
    expect(ids.map((i) => [i.number, i.size, i.emptied])).toEqual([[1, 60, false], [2, 0, true], [3, 20, false]]);
    expect(ids.flatMap((i) => i.flags.filter((f) => f.role === 'subject'))).toEqual([]);
  });

  it('refuses a table whose rows do not match the labels', () => {
    expect(() => clusterIdentities({ state: state0, table: { ...table, nRows: 79 }, roles })).toThrow(/80 labels for 79 windows/);
  });
});

describe('exportedClusterRecord', () => {
  it('writes HDBSCAN\'s noise cluster by its number', () => {
    const c = { method: 'hdbscan' as const, minClusterSize: 5, minSamples: 5, k: 3, clusters: 2, noise: 4, noiseCluster: 2, stability: [1, 2], preReduced: null, space: 'features' as const };
    expect(exportedClusterRecord(c).noiseCluster).toBe(3);
  });
});
