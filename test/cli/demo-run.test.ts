import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { adjustedRandIndex } from '../../src/core/metrics/ari';
import { ROOT, runCli, tempDir } from './run-cli';

// End-to-end on the demo study (demo-data/windows.csv, written by `npm run demo-data`; truth in
// demo-data/truth.csv: window_id, activity, loose_watch). DESIGN.md §5: 12 volunteers, 7
// activities, two of them wearing the watch loosely.
const WINDOWS = 'demo-data/windows.csv';
const TRUTH = join(ROOT, 'demo-data/truth.csv');

interface Summary {
  input: { sha256: string; rows: number; features: number };
  seed: number;
  version: string;
  cluster: { method: string; k: number; seed: number };
  embed: { method: string };
  recipe: unknown[];
  metrics: { silhouette: number; silhouetteSampleSize: number; subjectNMI: number; cramersV: number; subjectChiSquare: { statistic: number; dof: number; pValue: number } };
  subjectBoundRule: { maxEffectiveShare: number; minWindows: number; cohortEffectiveSubjects: number; text: string };
  clusters: {
    number: number; name: string; size: number; topSubject: string; topSubjectShare: number; subjects: number; effectiveSubjects: number;
    subjectEntropy: number; subjectBound: boolean; subjectBoundReason: string; bySubject: { subject: string; windows: number }[];
  }[];
  compositions: { column: string; nmi: number; cramersV: number | null; clusters: { number: number; top: string; topShare: number; effectiveValues: number; entropy: number; bound: boolean; boundReason: string }[] }[];
  labelAgreement: { column: string; labelledWindows: number; totalWindows: number; note: string; ari: number; nmi: number; purity: number; contingency: { counts: number[][] } };
  cautions: string[];
}

/** Our own CSV output has no quoted fields on the demo (ids and subjects are plain), so split is exact. */
function readRows(path: string): { header: string[]; rows: string[][] } {
  const lines = readFileSync(path, 'utf8').trimEnd().split('\n');
  return { header: lines[0].split(','), rows: lines.slice(1).map((l) => l.split(',')) };
}

let outA = '';
let outB = '';
let stdoutA = '';

beforeAll(() => {
  if (!existsSync(join(ROOT, WINDOWS)) || !existsSync(TRUTH)) {
    throw new Error('demo-data/windows.csv and truth.csv are missing: run `npm run demo-data` first');
  }
  outA = tempDir('demo-a');
  outB = tempDir('demo-b');
  for (const out of [outA, outB]) {
    const r = runCli(['analyze', WINDOWS, '--k', '7', '--seed', '1', '--compose', 'placement', '--out', out]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    stdoutA ||= r.stdout;
  }
}, 120_000);

describe('gleaner analyze on the demo windows, k = 7 (the number of true activities)', () => {
  it('writes windows.csv with the documented header, one row per window, and a summary', () => {
    const { header, rows } = readRows(join(outA, 'windows.csv'));
    expect(header).toEqual(['id', 'subject', 'start', 'end', 'x', 'y', 'cluster', 'cluster_name', 'confidence']);
    const summary = JSON.parse(readFileSync(join(outA, 'summary.json'), 'utf8')) as Summary;
    expect(rows).toHaveLength(summary.input.rows);
    expect(summary.input.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(summary).toMatchObject({ seed: 1, cluster: { method: 'kmeans', k: 7, seed: 1 }, embed: { method: 'pca' } });
    expect(summary.clusters.reduce((s, c) => s + c.size, 0)).toBe(rows.length);
    expect(summary.cautions.join(' ')).toMatch(/not clinical findings or diagnoses/);
    expect(summary).not.toHaveProperty('createdAt');
    for (const r of rows) {
      // Clusters are numbered 1..k (index + 1), as on screen, with their shown name beside.
      const cluster = Number(r[6]);
      const confidence = Number(r[8]);
      expect(Number.isInteger(cluster) && cluster >= 1 && cluster <= 7).toBe(true);
      expect(r[7]).toBe(`candidate ${cluster}`);
      expect(confidence >= 0 && confidence <= 1).toBe(true);
    }
    expect(stdoutA).toMatch(/in 7 clusters/);
  });

  it('recovers the planted activities: ARI against truth.csv above the stated floor', () => {
    const truth = new Map(readRows(TRUTH).rows.map((r) => [r[0], r[1]]));
    const { rows } = readRows(join(outA, 'windows.csv'));
    const activities: string[] = [];
    const a = Int32Array.from(rows, (r) => Number(r[6]));
    const b = Int32Array.from(rows, (r) => {
      const activity = truth.get(r[0]);
      if (activity === undefined) throw new Error(`window ${r[0]} is not in truth.csv`);
      if (!activities.includes(activity)) activities.push(activity);
      return activities.indexOf(activity);
    });
    expect(activities).toHaveLength(7);
    // The floor, from the generator's class separation (demo-data/sim/activities.ts): walking,
    // stairs, tooth-brushing and cycling each have their own rhythm and wrist pose; resting is
    // still; typing and eating are both small hand motions with the forearm on a table, and the two
    // loose-watch volunteers' jitter is by design strong enough to pull their windows into a
    // cluster of their own. With k = 7 the best a faithful run can do is therefore about: the four
    // moving classes and resting each found, typing + eating shared, one cluster for the loose
    // watches. That reference labelling scores ARI 0.679 against truth (computed with this
    // project's adjustedRandIndex on the same truth.csv). Measured: 0.653 (seeds 1, 2 and 3 alike;
    // demo windows.csv sha256 1ed1dbd3…, re-measure if the generator changes).
    // The floor 0.60 sits 0.05 below the measurement and fails a run that merges one more pair of
    // classes (the reference with walking and stairs also merged scores 0.589 by the same
    // computation) or one driven by subjects (subject as the clustering: ARI 0.004).
    const ari = adjustedRandIndex(a, b);
    expect(ari).toBeGreaterThan(0.6);
  });

  it('keeps the loose-watch windows traceable: a cluster in summary.json is dominated by the two loose-watch subjects', () => {
    // Logic: truth.csv names the loose-watch windows; windows.csv maps each window to its subject,
    // which gives the loose-watch subjects (DESIGN.md §5: exactly two). Reading summary.json alone,
    // at least one cluster must draw >= 90% of its windows from those two subjects, have one of them
    // as its top subject and hold few subjects in effect (exp(entropy) <= 3, where the behaviour
    // clusters hold ~10 of 12), and such clusters together must hold most (>= 50%) of the
    // loose-watch subjects' windows, so that their windows are not silently spread among the
    // behaviour clusters. Measured (seed 1): one cluster, 98% loose-watch, effective subjects 2.2,
    // holding ~700 of the 711 loose-watch windows.
    const looseIds = new Set(readRows(TRUTH).rows.filter((r) => r[2] === '1').map((r) => r[0]));
    const { rows } = readRows(join(outA, 'windows.csv'));
    const looseSubjects = new Set(rows.filter((r) => looseIds.has(r[0])).map((r) => r[1]));
    expect(looseSubjects.size).toBe(2);
    const looseWindows = rows.filter((r) => looseSubjects.has(r[1])).length;

    const summary = JSON.parse(readFileSync(join(outA, 'summary.json'), 'utf8')) as Summary;
    const looseIn = (c: Summary['clusters'][number]) =>
      c.bySubject.filter((e) => looseSubjects.has(e.subject)).reduce((s, e) => s + e.windows, 0);
    const dominated = summary.clusters.filter((c) => c.size > 0 && looseIn(c) / c.size >= 0.9);
    expect(dominated.length).toBeGreaterThanOrEqual(1);
    for (const c of dominated) {
      expect(looseSubjects.has(c.topSubject)).toBe(true);
      expect(c.effectiveSubjects).toBeLessThanOrEqual(3);
    }
    const held = dominated.reduce((s, c) => s + looseIn(c), 0);
    expect(held / looseWindows).toBeGreaterThanOrEqual(0.5);

    // The summary's per-subject counts agree with windows.csv, window for window.
    for (const c of summary.clusters) {
      for (const e of c.bySubject) {
        const n = rows.filter((r) => r[6] === String(c.number) && r[1] === e.subject).length;
        expect(n).toBe(e.windows);
      }
    }
  });

  it('flags the loose-watch cluster subject-bound in summary.json, and no other, with the reason', () => {
    // Rule: docs/subject-bound.md (effective subjects at most 0.35 of the cohort's).
    // Which cluster is the loose-watch one comes from truth.csv (>= 90% loose-watch windows).
    const looseIds = new Set(readRows(TRUTH).rows.filter((r) => r[2] === '1').map((r) => r[0]));
    const { rows } = readRows(join(outA, 'windows.csv'));
    const summary = JSON.parse(readFileSync(join(outA, 'summary.json'), 'utf8')) as Summary;
    const looseShare = (id: number) => {
      const members = rows.filter((r) => r[6] === String(id));
      return members.filter((r) => looseIds.has(r[0])).length / members.length;
    };
    expect(summary.subjectBoundRule).toMatchObject({ maxEffectiveShare: 0.35, minWindows: 20 });
    expect(summary.subjectBoundRule.cohortEffectiveSubjects).toBeGreaterThan(11); // 12 volunteers, near-even
    for (const c of summary.clusters) {
      expect(c.subjectBound, c.subjectBoundReason).toBe(looseShare(c.number) >= 0.9);
      expect(c.subjectBoundReason).toMatch(/effective subjects against \d+\.\d in the cohort/);
      expect(c.subjectEntropy >= 0 && c.subjectEntropy <= 1).toBe(true);
      // Normalized entropy is ln(effective subjects) / ln(12 subjects) (definition in cluster-mix.ts).
      expect(c.subjectEntropy).toBeCloseTo(Math.log(c.effectiveSubjects) / Math.log(12), 9);
    }
    expect(summary.clusters.filter((c) => c.subjectBound)).toHaveLength(1);
    // Clusters follow activities more than subjects, yet the loose-watch cluster ties them to subjects
    // (measured, seed 1: NMI 0.19, Cramér's V 0.41; chi-square p underflows to 0).
    expect(summary.metrics.subjectNMI).toBeGreaterThan(0.05);
    expect(summary.metrics.subjectNMI).toBeLessThan(0.5);
    expect(summary.metrics.cramersV).toBeGreaterThan(0.2);
    expect(summary.metrics.subjectChiSquare.dof).toBe(66); // (7 - 1) × (12 - 1)
    expect(summary.metrics.subjectChiSquare.pValue).toBeLessThan(1e-6);
  });

  it('adds --compose columns and the partial-label agreement, marked with its number of labelled windows', () => {
    const summary = JSON.parse(readFileSync(join(outA, 'summary.json'), 'utf8')) as Summary;
    // placement holds one value ("left wrist") in the demo: nothing to tell apart, nothing flagged,
    // Cramér's V undefined (written null).
    expect(summary.compositions).toHaveLength(1);
    const p = summary.compositions[0];
    expect(p).toMatchObject({ column: 'placement', nmi: 0, cramersV: null });
    for (const c of p.clusters) expect(c).toMatchObject({ top: 'left wrist', topShare: 1, effectiveValues: 1, bound: false });
    const labelled = readRows(join(ROOT, WINDOWS)).rows.filter((r) => r[7] !== '').length;
    const a = summary.labelAgreement;
    expect(a.column).toBe('activity_label');
    expect(a.labelledWindows).toBe(labelled);
    expect(a.note).toBe(`computed on the ${labelled} of ${summary.input.rows} windows that carry a label in "activity_label"`);
    expect(a.contingency.counts.flat().reduce((x, y) => x + y, 0)).toBe(labelled);
    // The same floor reasoning as the ARI test above, on a few hundred labelled windows (measured 0.63).
    expect(a.ari).toBeGreaterThan(0.5);
    expect(a.purity > 0.5 && a.purity <= 1).toBe(true);
  });

  it('fails before the analysis, in one line, when --compose names no column', () => {
    const r = runCli(['analyze', WINDOWS, '--k', '7', '--compose', 'site', '--out', tempDir('compose')]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^gleaner: windows\.csv, column "site": expected a column of this name to compose by \(columns: window_id, .*\), found "no such column"\n$/);
  });

  it('is reproducible: same input and seed give byte-identical windows.csv and summary.json', () => {
    // Determinism rule of DESIGN.md §3 (same inputs + recipe + seed → identical outputs).
    // Buffer.equals: a byte comparison (a deep toEqual over 2 MB is needlessly slow).
    for (const name of ['windows.csv', 'summary.json']) {
      const a = readFileSync(join(outA, name));
      const b = readFileSync(join(outB, name));
      expect(a.length).toBeGreaterThan(0);
      expect(b.equals(a), `${name} differs between the two runs`).toBe(true);
    }
  });
});
