import { describe, expect, it } from 'vitest';
import type { AnalysisParams, AnalysisResult } from '../../../src/core/analysis.types';
import { CAUTIONS } from '../../../src/core/cautions';
import { clusterComposition } from '../../../src/core/export/cluster-composition';
import { mapCsv } from '../../../src/core/export/map-csv';
import { buildProvenance } from '../../../src/core/export/provenance';
import { weakLabelsCsv } from '../../../src/core/export/weak-labels';
import { clusterIdentities } from '../../../src/core/export/run-model';
import { emptyNote } from '../../../src/core/curation/initial-state';
import type { ClusterNote } from '../../../src/core/curation/curation.types';
import type { Roles } from '../../../src/core/table/roles.types';
import type { Column, Table } from '../../../src/core/table/table';

function text(name: string, values: string[]): Column {
  const dictionary = [...new Set(values.filter((v) => v !== ''))];
  return { kind: 'categorical', name, dictionary, codes: Int32Array.from(values, (v) => (v === '' ? -1 : dictionary.indexOf(v))) };
}
function num(name: string, values: number[]): Column {
  return { kind: 'numeric', name, values: Float64Array.from(values) };
}

const table: Table = {
  fileName: 'w.csv',
  nRows: 3,
  columns: [
    text('window_id', ['a1', 'a,2', 'a"3']),
    text('pid', ['S01', 'S01', 'S02']),
    num('t0', [0, 5, 1700000000.25]),
    num('dur', [5, 5, 0.5]),
    num('acc_x_mean', [0.1, 0.2, 0.3]),
  ],
};
const roles: Roles = [
  { name: 'window_id', role: 'id', evidence: '' },
  { name: 'pid', role: 'subject', evidence: '' },
  { name: 't0', role: 'start', evidence: '' },
  { name: 'dur', role: 'duration', evidence: '' },
  { name: 'acc_x_mean', role: 'feature', evidence: '' },
];
const params: AnalysisParams = { k: 2, seed: 42, restarts: 3, maxIterations: 100, silhouetteSample: 2000 };
const result: AnalysisResult = {
  recipe: [{ step: 'zscore', params: {}, effect: { features: 1 } }],
  embed: { method: 'pca', components: 2, explainedVarianceRatio: [0.9, 0.1] },
  coords: Float32Array.from([0.5, -0.25, 1 / 3, 2, -0, 1e-9]),
  cluster: { method: 'kmeans', k: 2, restarts: 3, maxIterations: 100, init: 'k-means++', iterations: 4, inertia: 1.5, converged: true },
  labels: Int32Array.from([0, 0, 1]),
  confidence: Float32Array.from([0.75, 0.123456, 1]),
  centroids: Float64Array.from([0.15, 0.3]),
  sizes: Int32Array.from([2, 1]),
  metrics: { silhouette: 0.5, silhouetteSampleSize: 3 },
};

/** Identities of a curation given by its labels and partial notes (no table: no flags). */
function identities(labels: Int32Array, notes: Partial<ClusterNote>[]) {
  return clusterIdentities({ state: { labels, clusters: notes.map((n) => ({ ...emptyNote(), ...n })) } });
}
const named = identities(result.labels, [{ className: 'walking' }, {}]);

describe('weakLabelsCsv({ table, roles, result, identities })', () => {
  it('writes the weak-label columns from the roles, blank where a role has no column; clusters by number and name', () => {
    const csv = weakLabelsCsv({ table, roles, result, identities: named });
    expect(csv.split('\n')).toEqual([
      'window_id,subject,session,start,end,cluster,cluster_name,class_name,confidence,set_aside,flags',
      'a1,S01,,0,5,1,walking,walking,0.75,0,',
      // RFC 4180 §2 rules 6-7: the comma and the quote force quoting, quotes doubled;
      // confidence to 4 significant digits.
      '"a,2",S01,,5,10,1,walking,walking,0.1235,0,',
      // end = start + duration, with enough digits for epoch seconds; cluster 2 is an unnamed candidate.
      '"a""3",S02,,1700000000.25,1700000000.75,2,candidate 2,,1,0,',
      '',
    ]);
  });

  it('writes curated labels and set_aside = 1 (with a blank class) for windows of a set-aside cluster', () => {
    const labels = Int32Array.from([1, 0, 1]);
    const csv = weakLabelsCsv({ table, roles, result, identities: identities(labels, [{ className: 'walking' }, { name: 'noise', setAside: true }]), labels });
    expect(csv.split('\n').slice(1, 4)).toEqual([
      'a1,S01,,0,5,2,noise,,0.75,1,',
      '"a,2",S01,,5,10,1,walking,walking,0.1235,0,',
      '"a""3",S02,,1700000000.25,1700000000.75,2,noise,,1,1,',
    ]);
  });

  it('writes each cluster\'s composition flags', () => {
    const ids = named.map((id) => (id.index === 1 ? { ...id, flags: [{ column: 'pid', role: 'subject' as const, text: 'subject-bound', reason: 'r' }, { column: 'site', role: 'metadata' as const, text: 'site-bound', reason: 'r' }] } : id));
    const lines = weakLabelsCsv({ table, roles, result, identities: ids }).split('\n');
    expect(lines[3].split(',').at(-1)).toBe('subject-bound; site-bound');
    expect(lines[1].split(',').at(-1)).toBe('');
  });

  it('adds placed (1 = placed from sampled neighbours) only when the run sampled', () => {
    const sampled = { ...result, placed: Uint8Array.from([0, 1, 0]) };
    const lines = weakLabelsCsv({ table, roles, result: sampled, identities: named }).split('\n');
    expect(lines[0]).toBe('window_id,subject,session,start,end,cluster,cluster_name,class_name,confidence,set_aside,flags,placed');
    expect(lines.slice(1, 4).map((l) => l.split(',').at(-1))).toEqual(['0', '1', '0']);
  });
});

describe('mapCsv({ table, roles, result, identities })', () => {
  it('writes id, subject, start, end, map coordinates, cluster number and name, and confidence', () => {
    const lines = mapCsv({ table, roles, result, identities: named }).split('\n');
    expect(lines[0]).toBe('id,subject,start,end,x,y,cluster,cluster_name,confidence');
    expect(lines[1]).toBe('a1,S01,0,5,0.5,-0.25,1,walking,0.75');
    // Float32 1/3 printed to 7 significant digits; -0 as 0; confidence to 4 digits.
    expect(lines[2]).toBe('"a,2",S01,5,10,0.3333333,2,1,walking,0.1235');
    expect(lines[3]).toBe('"a""3",S02,1700000000.25,1700000000.75,0,1e-9,2,candidate 2,1');
  });

  it('uses the row index as id when no column has the id role', () => {
    const noId = roles.filter((r) => r.role !== 'id');
    const lines = mapCsv({ table, roles: noId, result, identities: named }).split('\n');
    expect(lines.slice(1, 4).map((l) => l.split(',')[0])).toEqual(['0', '1', '2']);
  });
});

describe('clusterComposition(labels, k, subject)', () => {
  it('counts windows per subject in each cluster, top subject first', () => {
    const subject = text('pid', ['S1', 'S1', 'S2', 'S2', 'S2', 'S3', 'S3']);
    const c = clusterComposition(Int32Array.from([0, 0, 0, 1, 1, 1, 2]), 3, subject);
    expect(c[0]).toMatchObject({ id: 0, size: 3, topSubject: 'S1', subjects: 2, bySubject: [{ subject: 'S1', windows: 2 }, { subject: 'S2', windows: 1 }] });
    expect(c[0].topSubjectShare).toBeCloseTo(2 / 3, 12);
    // exp(entropy) of shares (2/3, 1/3): exp(-(2/3 ln 2/3 + 1/3 ln 1/3)) = 1.88988 (computed by hand).
    expect(c[0].effectiveSubjects).toBeCloseTo(1.8898816, 6);
    expect(c[1]).toMatchObject({ size: 3, topSubject: 'S2', topSubjectShare: 0.5 + 1 / 6, subjects: 2 });
    expect(c[2]).toMatchObject({ size: 1, topSubject: 'S3', topSubjectShare: 1, subjects: 1, effectiveSubjects: 1 });
  });

  it('reports an empty cluster as size 0 and counts windows without a subject column under ""', () => {
    const c = clusterComposition(Int32Array.from([0, 0]), 2, undefined);
    expect(c[0]).toMatchObject({ size: 2, topSubject: '', topSubjectShare: 1, subjects: 1 });
    expect(c[1]).toMatchObject({ size: 0, topSubject: '', topSubjectShare: 0, subjects: 0, effectiveSubjects: 0 });
  });
});

describe('buildProvenance(...)', () => {
  it('records input hash, roles, recipe, algorithms with parameters and seed, version, time and cautions', () => {
    const p = buildProvenance({
      input: { fileName: 'w.csv', sha256: 'ab'.repeat(32), rows: 3, features: 1 },
      roles, params, result, identities: named, appVersion: '0.1.0', createdAt: '2025-01-02T03:04:05.000Z',
    });
    expect(p).toMatchObject({
      app: { name: 'Gleaner', version: '0.1.0' },
      createdAt: '2025-01-02T03:04:05.000Z',
      input: { fileName: 'w.csv', sha256: 'ab'.repeat(32), rows: 3, features: 1 },
      recipe: [{ step: 'zscore', params: {}, effect: { features: 1 } }],
      embed: { method: 'pca', components: 2, seed: 42 },
      cluster: { method: 'kmeans', k: 2, restarts: 3, init: 'k-means++', maxIterations: 100, seed: 42 },
      seed: 42,
      clusters: [
        { number: 1, name: 'walking', size: 2, className: 'walking', setAside: false, flags: [] },
        { number: 2, name: 'candidate 2', size: 1, className: '', setAside: false, flags: [] },
      ],
      cautions: CAUTIONS,
    });
    expect(p.roles).toContainEqual({ column: 'pid', role: 'subject' });
    // JSON-ready: survives a round trip unchanged.
    expect(JSON.parse(JSON.stringify(p))).toEqual(p);
  });
});

describe('CAUTIONS', () => {
  it('carries the design cautions (DESIGN.md §6): research aid, not diagnosis; ethics and privacy; data stays local', () => {
    const all = CAUTIONS.join(' ');
    expect(all).toMatch(/research aids, not clinical findings or diagnoses/);
    expect(all).toMatch(/ethics approval, consent terms and local privacy law/);
    expect(all).toMatch(/on this machine/);
  });
});
