import { describe, expect, it } from 'vitest';
import { composeColumn } from '../../../src/core/composition/compose-column';
import type { Column } from '../../../src/core/table/table';
import { distributionPaths, cellAt, heatLayout, splitHistogram, zColour } from '../../../src/app/views/fingerprints/heat-map';
import { mixBars, segmentMask, selectedByValue } from '../../../src/app/views/mix/mix-bars';
import { compareResults, rowShares } from '../../../src/app/views/runs/compare';
import { subjectScaledRecipe } from '../../../src/app/lib/recipe-text';
import { resultRows, tableLabels } from '../../../src/app/lib/run-rows';
import { boutAt, buildStrips, panBy, windowAt, zoomAt } from '../../../src/app/views/timeline/strips';

const subjects = (codes: number[], names: string[]): Column => ({ kind: 'categorical', name: 'subject', codes: Int32Array.from(codes), dictionary: names });

describe('mixBars(composition, names, selected)', () => {
  const labels = Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1]);
  const col = subjects([0, 0, 0, 1, 0, 1, 2, 2], ['A', 'B', 'C']);
  const comp = composeColumn(labels, 2, col, { minWindows: 1 });

  it('puts the most concentrated cluster first and stacks its values largest first', () => {
    const bars = mixBars(comp, col.kind === 'categorical' ? col.dictionary : []);
    expect(bars.map((b) => b.cluster)).toEqual([0, 1]); // cluster 0: 3 A + 1 B (fewer effective values)
    expect(bars[0].segments.map((s) => [s.value, s.windows])).toEqual([['A', 3], ['B', 1]]);
    expect(bars[0].segments[1].start).toBeCloseTo(0.75);
    const total = bars[1].segments.reduce((s, x) => s + x.share, 0);
    expect(total).toBeCloseTo(1);
  });

  it('counts selected windows per segment and masks exactly one segment', () => {
    const rows = resultRows({ labels });
    const codes = Int32Array.from([0, 0, 0, 1, 0, 1, 2, 2]);
    const mask = segmentMask(labels, rows, codes, 1, 2);
    expect(Array.from(mask)).toEqual([0, 0, 0, 0, 0, 0, 1, 1]);
    const sel = selectedByValue(mask, labels, rows, codes, 2, 3);
    const bars = mixBars(comp, ['A', 'B', 'C'], sel);
    expect(bars.find((b) => b.cluster === 1)!.segments.find((s) => s.value === 'C')!.selected).toBe(2);
    expect(bars.find((b) => b.cluster === 0)!.segments.every((s) => s.selected === 0)).toBe(true);
  });
});

describe('run rows and comparison', () => {
  it('tableLabels spreads a run that dropped windows over the table rows', () => {
    const r = { labels: Int32Array.from([1, 0]), windows: Int32Array.from([0, 2]) };
    expect(Array.from(tableLabels(r, 3))).toEqual([1, -1, 0]);
  });

  it('compareResults gives the ARI of a published example', () => {
    // scikit-learn 1.x docs, adjusted_rand_score: labels [0,0,1,1] vs [0,0,1,2] → 0.57 (0.5714…).
    const c = compareResults({ labels: Int32Array.from([0, 0, 1, 1]) }, { labels: Int32Array.from([0, 0, 1, 2]) }, 4);
    expect(c.ari).toBeCloseTo(0.5714, 3);
    expect(c.windows).toBe(4);
  });

  it('compareResults leaves out windows one run did not analyse', () => {
    const c = compareResults({ labels: Int32Array.from([0, 1, 1]), windows: Int32Array.from([0, 1, 2]) }, { labels: Int32Array.from([0, 1]), windows: Int32Array.from([0, 2]) }, 3);
    expect(c.windows).toBe(2);
    expect(c.ari).toBe(1);
  });

  it('rowShares makes each non-empty row sum to 1', () => {
    expect(rowShares([[1, 3], [0, 0]])).toEqual([[0.25, 0.75], [0, 0]]);
  });

  it('subjectScaledRecipe swaps the scaling step for a per-subject z-score and keeps the rest', () => {
    expect(subjectScaledRecipe(undefined).steps).toEqual([{ type: 'subject-zscore' }, { type: 'impute', method: 'mean', scope: 'global' }]);
    expect(subjectScaledRecipe({ version: 1, steps: [{ type: 'clip', lower: 1, upper: 99 }, { type: 'robust', quantileRange: [25, 75] }] }).steps)
      .toEqual([{ type: 'clip', lower: 1, upper: 99 }, { type: 'subject-zscore' }]);
  });
});

describe('timeline strips', () => {
  // Two subjects; 5 s windows; subject 0 has a gap between 10 s and 30 s.
  const start = [100, 105, 130, 110, 50, 55];
  const codes = Int32Array.from([0, 0, 0, 0, 1, 1]);
  const strips = buildStrips({ subjectCodes: codes, subjectNames: ['S01', 'S02'], start, rows: resultRows({ labels: new Int32Array(6) }) });

  it('orders each subject by start and measures time from its first window', () => {
    expect(strips.map((s) => s.subject)).toEqual(['S01', 'S02']);
    expect(Array.from(strips[0].starts)).toEqual([0, 5, 10, 30]);
    expect(Array.from(strips[0].ends)).toEqual([5, 10, 15, 35]); // median step 5 s
    expect(strips[0].span).toBe(35);
  });

  it('finds the window under a time and leaves gaps empty', () => {
    expect(windowAt(strips[0], 12)).toBe(2);
    expect(windowAt(strips[0], 20)).toBe(-1);
  });

  it('a bout stops at a cluster change or a gap', () => {
    const labels = Int32Array.from([2, 2, 2, 2, 0, 0]); // run rows 0,1,2,3 → strip order rows 0,1,3,2
    expect(boutAt(strips[0], labels, 1)).toEqual([0, 2]);
    expect(boutAt(strips[0], labels, 3)).toEqual([3, 3]);
  });

  it('zoom keeps the time under the pointer and pan stays in range', () => {
    const v = zoomAt({ t0: 0, t1: 100 }, 50, 0.5, 100);
    expect(v).toEqual({ t0: 25, t1: 75 });
    expect(panBy(v, 100, 100)).toEqual({ t0: 50, t1: 100 });
    expect(zoomAt(v, 50, 10, 100)).toEqual({ t0: 0, t1: 100 });
  });
});

describe('fingerprint heat map helpers', () => {
  it('zColour runs viridis from −2 to +2 sd and has no colour for NaN', () => {
    // matplotlib viridis ends: #440154 and #fde725 (lib/matplotlib/_cm_listed.py).
    expect(zColour(-5)).toEqual([0x44, 0x01, 0x54]);
    expect(zColour(2)).toEqual([0xfd, 0xe7, 0x25]);
    expect(zColour(NaN)).toBeNull();
  });

  it('cellAt maps points to cells and misses outside the grid', () => {
    const l = heatLayout(3, 4, 400);
    expect(cellAt(l, 3, 4, l.left + l.cellW * 1.5, l.top + l.cellH * 2.5)).toEqual({ row: 2, col: 1 });
    expect(cellAt(l, 3, 4, l.left - 1, l.top + 1)).toBeNull();
    expect(cellAt(l, 3, 4, l.left + 1, l.top + l.cellH * 3 + 1)).toBeNull();
  });

  it('splitHistogram separates one cluster from the rest; paths close at the baseline', () => {
    const counts = Float64Array.from([1, 2, /* c0 j1 */ 0, 0, /* c1 j0 */ 3, 4, /* c1 j1 */ 0, 0]); // k=2, d=2, bins=2
    const h = splitHistogram(counts, 2, 2, 2, 0, 0);
    expect(Array.from(h.inside)).toEqual([1, 2]);
    expect(Array.from(h.outside)).toEqual([3, 4]);
    const p = distributionPaths(h.inside, h.outside, 100, 20);
    expect(p.inside.startsWith('M0 20')).toBe(true);
    expect(p.inside.endsWith('L100 20 Z')).toBe(true);
  });
});
