import type { Affinities } from './affinities';
import type { QuadTree } from './quadtree';

/** Work arrays of the gradient, allocated once per run. */
export interface GradientBuffers {
  attract: Float64Array;
  repel: Float64Array;
  stack: Int32Array;
}

export function gradientBuffers(n: number): GradientBuffers {
  return { attract: new Float64Array(2 * n), repel: new Float64Array(2 * n), stack: new Int32Array(256) };
}

/**
 * Barnes–Hut t-SNE gradient into `grad` (n × 2): 4 · (exaggeration · Σ_j p_ij w_ij (y_i − y_j)
 * − Σ_j w_ij² (y_i − y_j) / Z), with w_ij = 1 / (1 + |y_i − y_j|²) and Z = Σ_{k≠l} w_kl; the
 * repulsive sums come from the quadtree, the attractive ones from the sparse P. Returns Z, and when
 * `wantCost` the KL divergence KL(P ‖ Q) of the un-exaggerated P.
 */
export function gradient(
  y: Float64Array, p: Affinities, tree: QuadTree, theta: number, exaggeration: number,
  grad: Float64Array, buf: GradientBuffers, wantCost: boolean,
): { z: number; cost: number | undefined } {
  const n = p.n;
  tree.build(y, n);
  const z = repulsion(y, n, tree, theta, buf.repel, buf.stack);
  const { attract } = buf;
  const { rowStart, columns, values } = p;
  let plogp = 0;
  let plogw = 0;
  for (let i = 0; i < n; i++) {
    const yi = y[2 * i], yj = y[2 * i + 1];
    let fx = 0, fy = 0;
    for (let e = rowStart[i]; e < rowStart[i + 1]; e++) {
      const j = columns[e];
      const dx = yi - y[2 * j], dy = yj - y[2 * j + 1];
      const w = 1 / (1 + dx * dx + dy * dy);
      const f = values[e] * w;
      fx += f * dx; fy += f * dy;
      if (wantCost && values[e] > 0) { plogp += values[e] * Math.log(values[e]); plogw += values[e] * Math.log(w); }
    }
    attract[2 * i] = fx; attract[2 * i + 1] = fy;
  }
  const { repel } = buf;
  const invZ = 1 / z;
  for (let t = 0; t < 2 * n; t++) grad[t] = 4 * (exaggeration * attract[t] - repel[t] * invZ);
  // KL = Σ p log p − Σ p log w + log Z, as Σ p = 1.
  return { z, cost: wantCost ? plogp - plogw + Math.log(z) : undefined };
}

/**
 * Repulsive sums Σ_j w_ij² (y_i − y_j) into `out` for every i, and returns Z = Σ_i Σ_{j≠i} w_ij.
 * A cell is summarised by its centre of mass when its width / distance < theta and the point
 * lies outside it (so a point never repels itself, whatever theta).
 */
function repulsion(y: Float64Array, n: number, tree: QuadTree, theta: number, out: Float64Array, stack: Int32Array): number {
  const { cx, cy, half, sumX, sumY, count, firstChild, head, next } = tree;
  const theta2 = theta * theta;
  let z = 0;
  for (let i = 0; i < n; i++) {
    const xi = y[2 * i], yi = y[2 * i + 1];
    let fx = 0, fy = 0, zi = 0;
    let top = 0;
    stack[top++] = 0;
    while (top > 0) {
      const v = stack[--top];
      const c = count[v];
      if (c === 0) continue;
      if (firstChild[v] < 0) {
        for (let j = head[v]; j >= 0; j = next[j]) {
          if (j === i) continue;
          const dx = xi - y[2 * j], dy = yi - y[2 * j + 1];
          const w = 1 / (1 + dx * dx + dy * dy);
          zi += w; fx += w * w * dx; fy += w * w * dy;
        }
        continue;
      }
      const h = half[v];
      const outside = Math.abs(xi - cx[v]) > h || Math.abs(yi - cy[v]) > h;
      const mx = sumX[v] / c, my = sumY[v] / c;
      const dx = xi - mx, dy = yi - my;
      const d2 = dx * dx + dy * dy;
      if (outside && 4 * h * h < theta2 * d2) {
        const w = 1 / (1 + d2);
        zi += c * w; fx += c * w * w * dx; fy += c * w * w * dy;
      } else {
        const f = firstChild[v];
        stack[top++] = f; stack[top++] = f + 1; stack[top++] = f + 2; stack[top++] = f + 3;
      }
    }
    out[2 * i] = fx; out[2 * i + 1] = fy;
    z += zi;
  }
  return z;
}
