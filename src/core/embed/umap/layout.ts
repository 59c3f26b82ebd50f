import type { Random } from '../../random';
import type { SparseGraph } from './fuzzy-graph';
import { buildLogTable, tableAt } from './log-table';

export interface LayoutSettings {
  epochs: number;
  a: number;
  b: number;
  negativeSampleRate: number;
  learningRate: number;
  /** Weight of the repulsive term (1). */
  repulsion?: number;
}

/** Largest gradient component per step (UMAP's clip). */
const CLIP = 4;

/**
 * The UMAP layout optimisation: stochastic gradient descent over the graph's edges. An edge of
 * weight w is sampled every max(w)/w epochs and pulls its two ends together; each sample pushes its
 * head away from `negativeSampleRate` random points. The learning rate decays linearly over the
 * epochs. Edges lighter than max(w)/epochs are never sampled and are dropped up front.
 *
 * Work can be cut anywhere (`run(maxSamples)`) so a driver can check for cancellation between
 * short slices; the result does not depend on where it was cut.
 */
export class LayoutOptimizer {
  readonly epochs: number;
  private readonly head: Int32Array;
  private readonly tail: Int32Array;
  private readonly epochsPerSample: Float64Array;
  private readonly nextSample: Float64Array;
  private readonly epochsPerNegative: Float64Array;
  private readonly nextNegative: Float64Array;
  private readonly a: number;
  private readonly b: number;
  private readonly gamma: number;
  private readonly initialAlpha: number;
  /** |attractive coefficient| 2ab·d²^(b−1) / (a·d²^b + 1) by squared distance. */
  private readonly attraction: Float64Array;
  /** Repulsive coefficient 2γb / ((0.001 + d²)(a·d²^b + 1)) by squared distance. */
  private readonly repulsionTable: Float64Array;
  private alpha: number;
  private epochDone = 0;
  private cursor = 0;
  private state: number;

  /** `embedding` (n × 2, row-major) is moved in place. */
  constructor(graph: SparseGraph, private readonly embedding: Float64Array, settings: LayoutSettings, random: Random) {
    this.epochs = settings.epochs;
    this.a = settings.a;
    this.b = settings.b;
    this.gamma = settings.repulsion ?? 1;
    this.initialAlpha = settings.learningRate;
    this.alpha = settings.learningRate;
    const { a, b } = settings;
    const gamma = this.gamma;
    this.attraction = buildLogTable((x) => attractive(x, a, b));
    this.repulsionTable = buildLogTable((x) => repulsive(x, a, b, gamma));
    // The negative-sampling stream is a fast inline generator seeded from the injected one.
    this.state = (Math.floor(random() * 4294967296) >>> 0) || 1;
    const { rowStart, cols, weights, n } = graph;
    let wMax = 0;
    for (let e = 0; e < weights.length; e++) wMax = Math.max(wMax, weights[e]);
    const threshold = wMax / settings.epochs;
    let m = 0;
    for (let e = 0; e < weights.length; e++) if (weights[e] >= threshold && weights[e] > 0) m++;
    this.head = new Int32Array(m);
    this.tail = new Int32Array(m);
    this.epochsPerSample = new Float64Array(m);
    let p = 0;
    for (let i = 0; i < n; i++) {
      for (let e = rowStart[i]; e < rowStart[i + 1]; e++) {
        if (!(weights[e] >= threshold && weights[e] > 0)) continue;
        this.head[p] = i;
        this.tail[p] = cols[e];
        this.epochsPerSample[p] = wMax / weights[e];
        p++;
      }
    }
    this.nextSample = Float64Array.from(this.epochsPerSample);
    const rate = settings.negativeSampleRate;
    this.epochsPerNegative = this.epochsPerSample.map((v) => (rate > 0 ? v / rate : Infinity));
    this.nextNegative = Float64Array.from(this.epochsPerNegative);
  }

  /** Epochs completed so far. */
  get epoch(): number {
    return this.epochDone;
  }

  get done(): boolean {
    return this.epochDone >= this.epochs;
  }

  /** Number of edges visited per epoch (sampled or not). */
  get edgeCount(): number {
    return this.head.length;
  }

  /**
   * Goes on for at most `maxEdges` edge visits (stopping early at the end of an epoch when
   * `stopAtEpochEnd`). Returns true while epochs remain.
   */
  run(maxEdges: number, stopAtEpochEnd = false): boolean {
    let budget = Math.max(1, maxEdges);
    while (!this.done && budget > 0) {
      const end = Math.min(this.head.length, this.cursor + budget);
      budget -= end - this.cursor;
      this.visit(this.cursor, end);
      this.cursor = end;
      if (this.cursor === this.head.length) {
        this.cursor = 0;
        this.epochDone++;
        this.alpha = this.initialAlpha * (1 - this.epochDone / this.epochs);
        if (stopAtEpochEnd) break;
      }
    }
    return !this.done;
  }

  private visit(from: number, to: number): void {
    const { head, tail, embedding: y, epochsPerSample, nextSample, epochsPerNegative, nextNegative, a, b } = this;
    const n = y.length / 2;
    const epoch = this.epochDone;
    const alpha = this.alpha;
    const { attraction, repulsionTable: repulsion, gamma } = this;
    let state = this.state;
    for (let e = from; e < to; e++) {
      if (nextSample[e] > epoch) continue;
      const j = head[e];
      const k = tail[e];
      const jx = 2 * j;
      const kx = 2 * k;
      let dx = y[jx] - y[kx];
      let dy = y[jx + 1] - y[kx + 1];
      let d2 = dx * dx + dy * dy;
      if (d2 > 0) {
        let magnitude = tableAt(attraction, d2);
        if (magnitude < 0) magnitude = attractive(d2, a, b);
        const coeff = -magnitude;
        const gx = clip(coeff * dx) * alpha;
        const gy = clip(coeff * dy) * alpha;
        y[jx] += gx;
        y[jx + 1] += gy;
        y[kx] -= gx;
        y[kx + 1] -= gy;
      }
      nextSample[e] += epochsPerSample[e];
      const negatives = Math.floor((epoch - nextNegative[e]) / epochsPerNegative[e]);
      const count = negatives > 0 ? negatives : 0;
      for (let s = 0; s < count; s++) {
        // xorshift32 step
        state ^= state << 13;
        state ^= state >>> 17;
        state ^= state << 5;
        const other = (((state >>> 0) * n) / 4294967296) | 0;
        if (other === j) continue;
        const ox = 2 * other;
        dx = y[jx] - y[ox];
        dy = y[jx + 1] - y[ox + 1];
        d2 = dx * dx + dy * dy;
        if (d2 > 0) {
          let coeff = tableAt(repulsion, d2);
          if (coeff < 0) coeff = repulsive(d2, a, b, gamma);
          y[jx] += clip(coeff * dx) * alpha;
          y[jx + 1] += clip(coeff * dy) * alpha;
        }
      }
      nextNegative[e] += count * epochsPerNegative[e];
    }
    this.state = state;
  }
}

function attractive(d2: number, a: number, b: number): number {
  const pb = Math.pow(d2, b);
  return (2 * a * b * pb) / d2 / (a * pb + 1);
}

function repulsive(d2: number, a: number, b: number, gamma: number): number {
  return (2 * gamma * b) / ((0.001 + d2) * (a * Math.pow(d2, b) + 1));
}

function clip(v: number): number {
  return v > CLIP ? CLIP : v < -CLIP ? -CLIP : v;
}
