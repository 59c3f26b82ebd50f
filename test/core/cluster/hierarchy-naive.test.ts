import { describe, expect, it } from 'vitest';
import { cutTree, hierarchical, type Linkage } from '../../../src/core/cluster/hierarchy';
import { seededRandom, normal } from '../../../src/core/random';

/**
 * Textbook agglomeration (common practice; Lance–Williams update formulas, from memory): keep the
 * full matrix, merge the globally closest pair, update. O(n³), independent of the
 * nearest-neighbour chain and of Prim's tree, so agreement checks both.
 */
function naiveHeights(data: Float64Array, n: number, d: number, linkage: Linkage): number[] {
  const D = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => {
    let s = 0;
    for (let t = 0; t < d; t++) s += (data[i * d + t] - data[j * d + t]) ** 2;
    return Math.sqrt(s);
  }));
  const size = new Array(n).fill(1);
  const alive = new Array(n).fill(true);
  const heights: number[] = [];
  for (let step = 0; step < n - 1; step++) {
    let best = Infinity, a = -1, b = -1;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
      if (alive[i] && alive[j] && D[i][j] < best) { best = D[i][j]; a = i; b = j; }
    }
    heights.push(best);
    for (let i = 0; i < n; i++) {
      if (!alive[i] || i === a || i === b) continue;
      const [x, y, ni, na, nb] = [D[a][i], D[b][i], size[i], size[a], size[b]];
      let v: number;
      if (linkage === 'single') v = Math.min(x, y);
      else if (linkage === 'complete') v = Math.max(x, y);
      else if (linkage === 'average') v = (na * x + nb * y) / (na + nb);
      else v = Math.sqrt(((ni + na) * x * x + (ni + nb) * y * y - ni * best * best) / (ni + na + nb));
      D[a][i] = D[i][a] = v;
    }
    size[a] += size[b];
    alive[b] = false;
  }
  return heights.sort((p, q) => p - q);
}

function randomPoints(n: number, d: number, seed: number): Float64Array {
  const random = seededRandom(seed);
  const out = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    const shift = (i % 3) * 2.5;
    for (let j = 0; j < d; j++) out[i * d + j] = shift + normal(random);
  }
  return out;
}

describe('hierarchical against the textbook O(n³) agglomeration', () => {
  for (const linkage of ['ward', 'average', 'complete', 'single'] as const) {
    it(`${linkage}: same merge heights on 80 seeded points in 5-D`, async () => {
      const data = randomPoints(80, 5, 11);
      const tree = await hierarchical(data, 80, 5, { linkage });
      const expected = naiveHeights(data, 80, 5, linkage);
      expected.forEach((h, i) => expect(tree.height[i]).toBeCloseTo(h, 9));
    });
  }

  it('is deterministic and its cuts have the sizes the tree reports', async () => {
    const data = randomPoints(200, 4, 3);
    const a = await hierarchical(data, 200, 4, { linkage: 'ward' });
    const b = await hierarchical(data, 200, 4, { linkage: 'ward' });
    expect(a).toEqual(b);
    const labels = cutTree(a, { k: 3 });
    const counts = [0, 0, 0];
    labels.forEach((c) => counts[c]++);
    // The last two merges join the three clusters of the cut: merge 197 joins two of them, so the
    // third holds the other 200 - size[197] windows, and the root holds all 200.
    expect(a.size[198]).toBe(200);
    expect(counts).toContain(200 - a.size[197]);
    const others = counts.filter((c, i) => i !== counts.indexOf(200 - a.size[197]));
    expect(others[0] + others[1]).toBe(a.size[197]);
  });
});
