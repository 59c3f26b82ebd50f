/** Depth at which cells stop splitting; points that still share a cell are kept in a list there. */
const MAX_DEPTH = 40;

/**
 * A point quadtree over 2-D coordinates in flat typed arrays (no per-node objects), rebuilt in
 * place each iteration. Node 0 is the root; an internal node's four children are consecutive
 * from `firstChild`. Every node keeps its count and the sum of its points' coordinates (centre of
 * mass = sum / count); a leaf keeps its points as a linked list (`head`, `next`).
 */
export class QuadTree {
  nodes = 0;
  cx: Float64Array;
  cy: Float64Array;
  /** Half the width of the (square) cell. */
  half: Float64Array;
  sumX: Float64Array;
  sumY: Float64Array;
  count: Int32Array;
  /** Index of the first of four children, or -1 for a leaf. */
  firstChild: Int32Array;
  /** First point of a leaf, or -1. */
  head: Int32Array;
  depth: Int32Array;
  /** Next point in the same leaf, or -1; indexed by point. */
  next: Int32Array;

  constructor(n: number) {
    this.next = new Int32Array(n);
    const cap = Math.max(64, 4 * n);
    this.cx = new Float64Array(cap); this.cy = new Float64Array(cap); this.half = new Float64Array(cap);
    this.sumX = new Float64Array(cap); this.sumY = new Float64Array(cap);
    this.count = new Int32Array(cap); this.firstChild = new Int32Array(cap);
    this.head = new Int32Array(cap); this.depth = new Int32Array(cap);
  }

  /** Rebuilds the tree over y (n × 2 interleaved). */
  build(y: Float64Array, n: number): void {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (let i = 0; i < n; i++) {
      const a = y[2 * i], b = y[2 * i + 1];
      if (a < minX) minX = a; if (a > maxX) maxX = a;
      if (b < minY) minY = b; if (b > maxY) maxY = b;
    }
    const half = Math.max(maxX - minX, maxY - minY, 1e-12) / 2 * (1 + 1e-9);
    this.nodes = 0;
    this.addNode((minX + maxX) / 2, (minY + maxY) / 2, half, 0);
    for (let i = 0; i < n; i++) this.insert(y, i);
  }

  private addNode(cx: number, cy: number, half: number, depth: number): number {
    if (this.nodes === this.cx.length) this.grow();
    const v = this.nodes++;
    this.cx[v] = cx; this.cy[v] = cy; this.half[v] = half; this.depth[v] = depth;
    this.sumX[v] = 0; this.sumY[v] = 0; this.count[v] = 0; this.firstChild[v] = -1; this.head[v] = -1;
    return v;
  }

  private insert(coords: Float64Array, i: number): void {
    const x = coords[2 * i], y = coords[2 * i + 1];
    let v = 0;
    for (;;) {
      this.count[v]++; this.sumX[v] += x; this.sumY[v] += y;
      if (this.firstChild[v] >= 0) { v = this.firstChild[v] + this.quadrant(v, x, y); continue; }
      if (this.head[v] < 0 || this.depth[v] >= MAX_DEPTH) { this.next[i] = this.head[v]; this.head[v] = i; return; }
      // An occupied leaf: split it and push its point (one point: leaves above MAX_DEPTH hold one) down.
      const p = this.head[v];
      this.head[v] = -1;
      const h = this.half[v] / 2, cx = this.cx[v], cy = this.cy[v], dep = this.depth[v] + 1;
      const c = this.addNode(cx - h, cy - h, h, dep);
      this.addNode(cx + h, cy - h, h, dep);
      this.addNode(cx - h, cy + h, h, dep);
      this.addNode(cx + h, cy + h, h, dep);
      this.firstChild[v] = c;
      const px = coords[2 * p], py = coords[2 * p + 1];
      const q = c + this.quadrant(v, px, py);
      this.count[q] = 1; this.sumX[q] = px; this.sumY[q] = py; this.head[q] = p; this.next[p] = -1;
      v = c + this.quadrant(v, x, y);
    }
  }

  private quadrant(v: number, x: number, y: number): number {
    return (x >= this.cx[v] ? 1 : 0) + (y >= this.cy[v] ? 2 : 0);
  }

  private grow(): void {
    const cap = this.cx.length * 2;
    const f = (a: Float64Array) => { const b = new Float64Array(cap); b.set(a); return b; };
    const g = (a: Int32Array) => { const b = new Int32Array(cap); b.set(a); return b; };
    this.cx = f(this.cx); this.cy = f(this.cy); this.half = f(this.half); this.sumX = f(this.sumX); this.sumY = f(this.sumY);
    this.count = g(this.count); this.firstChild = g(this.firstChild); this.head = g(this.head); this.depth = g(this.depth);
  }
}
