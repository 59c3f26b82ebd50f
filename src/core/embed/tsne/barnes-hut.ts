import { QuadTree } from './quadtree';
import type { Repulsion } from './repulsion.types';

/**
 * Barnes–Hut repulsion over a quadtree rebuilt each call: a cell is summarised by its centre of
 * mass when its width / distance < theta and the point lies outside it (so a point never repels
 * itself, whatever theta). theta = 0 is the exact O(n²) sum.
 */
export class BarnesHutRepulsion implements Repulsion {
  private readonly tree: QuadTree;
  private stack = new Int32Array(256);

  constructor(n: number, private readonly theta: number) {
    this.tree = new QuadTree(n);
  }

  compute(y: Float64Array, n: number, out: Float64Array): number {
    const tree = this.tree;
    tree.build(y, n);
    const { cx, cy, half, sumX, sumY, count, firstChild, head, next } = tree;
    const theta2 = this.theta * this.theta;
    let z = 0;
    for (let i = 0; i < n; i++) {
      const xi = y[2 * i], yi = y[2 * i + 1];
      let fx = 0, fy = 0, zi = 0;
      let top = 0;
      let stack = this.stack;
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
          if (top + 4 > stack.length) { const s = new Int32Array(stack.length * 2); s.set(stack); this.stack = stack = s; }
          const f = firstChild[v];
          stack[top++] = f; stack[top++] = f + 1; stack[top++] = f + 2; stack[top++] = f + 3;
        }
      }
      out[2 * i] = fx; out[2 * i + 1] = fy;
      z += zi;
    }
    return z;
  }
}
