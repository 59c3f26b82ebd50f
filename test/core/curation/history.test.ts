import { describe, expect, it } from 'vitest';
import { applyAction } from '../../../src/core/curation/apply-action';
import { createHistory, record, redo, replay, undo, type History } from '../../../src/core/curation/history';
import { initialCuration } from '../../../src/core/curation/initial-state';
import type { CurationAction, CurationState } from '../../../src/core/curation/curation.types';
import { OptionError } from '../../../src/core/errors';
import { seededRandom } from '../../../src/core/random';

/** A deep, independent copy, so later mutation (if any) would show as a difference. */
function snapshot(s: CurationState) {
  return { labels: Array.from(s.labels), clusters: s.clusters.map((c) => ({ ...c })) };
}

/** Windows of cluster c, in order. */
function members(s: CurationState, c: number): number[] {
  const out: number[] = [];
  s.labels.forEach((l, i) => { if (l === c) out.push(i); });
  return out;
}

/** A seeded mix of all eight action types that fit the state they are applied to. */
function mixedAction(s: CurationState, step: number, random: () => number): CurationAction {
  const k = s.clusters.length;
  const sizes = Array.from({ length: k }, (_, c) => members(s, c).length);
  const nonEmpty = sizes.flatMap((n, c) => (n > 0 ? [c] : []));
  const pick = (xs: number[]) => xs[Math.floor(random() * xs.length)];
  switch (step % 8) {
    case 0: return { type: 'name', cluster: pick(nonEmpty), name: `name ${step}` };
    case 1: return { type: 'colour', cluster: pick(nonEmpty), colour: `#${(step * 0x151515).toString(16).padStart(6, '0').slice(-6)}` };
    case 2: return { type: 'describe', cluster: pick(nonEmpty), description: `seen at step ${step}` };
    case 3: {
      const big = nonEmpty.filter((c) => sizes[c] >= 2);
      const c = pick(big);
      return { type: 'split', cluster: c, k: 2, parts: Int32Array.from({ length: sizes[c] }, (_, j) => (j % 3 === 0 ? 1 : 0)) };
    }
    case 4: return { type: 'set-aside', cluster: pick(nonEmpty), value: step % 16 === 4 };
    case 5: {
      const windows = Int32Array.from({ length: 3 }, () => Math.floor(random() * s.labels.length));
      return { type: 'move', windows, to: random() < 0.3 ? k : pick(nonEmpty) };
    }
    case 6: return { type: 'promote', cluster: pick(nonEmpty), className: `class ${step}` };
    default: {
      const [into, from] = [nonEmpty[0], nonEmpty[nonEmpty.length - 1]];
      return { type: 'merge', into, from: [from] };
    }
  }
}

describe('History: undo/redo through 20 mixed curation actions', () => {
  it('returns to each earlier state exactly, step by step, and redo comes back to each later one', () => {
    const random = seededRandom(7);
    const labels = Int32Array.from({ length: 60 }, (_, i) => i % 4);
    let h: History = createHistory(initialCuration(labels, 4));
    const states = [snapshot(h.present)];
    const actions: CurationAction[] = [];
    for (let step = 0; step < 20; step++) {
      const a = mixedAction(h.present, step, random);
      actions.push(a);
      h = record(h, a);
      states.push(snapshot(h.present));
    }
    expect(new Set(actions.map((a) => a.type)).size).toBe(8);
    // Replaying the recorded actions (as a reopened study does) reaches the same state.
    expect(snapshot(replay(initialCuration(labels, 4), h.done))).toEqual(states[20]);
    for (let i = 19; i >= 0; i--) {
      h = undo(h);
      expect(snapshot(h.present)).toEqual(states[i]);
      expect(h.done).toEqual(actions.slice(0, i));
    }
    expect(undo(h)).toBe(h); // nothing left to undo
    for (let i = 1; i <= 20; i++) {
      h = redo(h);
      expect(snapshot(h.present)).toEqual(states[i]);
    }
    expect(h.done).toEqual(actions);
    expect(redo(h)).toBe(h);
  });

  it('a new action after undo drops the redo branch', () => {
    let h = createHistory(initialCuration(Int32Array.from([0, 1]), 2));
    h = record(h, { type: 'name', cluster: 0, name: 'a' });
    h = undo(h);
    h = record(h, { type: 'name', cluster: 1, name: 'b' });
    expect(h.future).toEqual([]);
    expect(h.undone).toEqual([]);
    expect(h.present.clusters.map((c) => c.name)).toEqual(['', 'b']);
  });
});

describe('applyAction(state, action)', () => {
  const base = initialCuration(Int32Array.from([0, 1, 2, 0, 1, 2]), 3);

  it('never changes the state it is given, and shares the labels when no window moves', () => {
    const before = snapshot(base);
    const named = applyAction(base, { type: 'name', cluster: 1, name: 'x' });
    applyAction(base, { type: 'merge', into: 0, from: [1, 2] });
    expect(snapshot(base)).toEqual(before);
    expect(named.labels).toBe(base.labels);
    expect(named.clusters[0]).toBe(base.clusters[0]);
  });

  it('merge empties the merged clusters and marks them', () => {
    const s = applyAction(base, { type: 'merge', into: 2, from: [0] });
    expect(Array.from(s.labels)).toEqual([2, 1, 2, 2, 1, 2]);
    expect(s.clusters[0].mergedInto).toBe(2);
  });

  it('split keeps part 0 in place and appends the other parts as new clusters', () => {
    const s = applyAction(base, { type: 'split', cluster: 1, k: 3, parts: Int32Array.from([2, 1]) });
    expect(Array.from(s.labels)).toEqual([0, 4, 2, 0, 3, 2]);
    expect(s.clusters).toHaveLength(5);
  });

  it('move to clusters.length opens a new cluster', () => {
    const s = applyAction(base, { type: 'move', windows: Int32Array.from([0, 5]), to: 3 });
    expect(Array.from(s.labels)).toEqual([3, 1, 2, 0, 1, 3]);
    expect(s.clusters).toHaveLength(4);
  });

  it('rejects actions that do not fit, naming the option', () => {
    expect(() => applyAction(base, { type: 'name', cluster: 3, name: 'x' })).toThrow(OptionError);
    expect(() => applyAction(base, { type: 'colour', cluster: 0, colour: 'red' })).toThrow(/invalid colour: "red"/);
    expect(() => applyAction(base, { type: 'split', cluster: 0, k: 2, parts: Int32Array.from([0]) })).toThrow(/one part index per window of cluster 0 \(2\)/);
    expect(() => applyAction(base, { type: 'merge', into: 0, from: [0] })).toThrow(/clusters other than the target 0/);
    expect(() => applyAction(base, { type: 'promote', cluster: 0, className: '  ' })).toThrow(/non-empty class name/);
    expect(() => applyAction(base, { type: 'move', windows: Int32Array.from([6]), to: 0 })).toThrow(/window indices from 0 to 5/);
  });
});
