import { upperPairs, type Affinities } from './affinities';
import { gradientAfterRepulsion, gradientBuffers, type GradientBuffers } from './gradient';
import { BarnesHutRepulsion } from './barnes-hut';
import { FftRepulsion } from './fft-repulsion';
import { COST_EVERY, learningRateOf, repulsionOf, resolveTsneOptions, type TsneOptions } from './options';
import { prepareTsne, type NeighbourInput } from './prepare';
import type { Repulsion } from './repulsion.types';

/** Early-exaggeration and final momentum, gain steps (common practice, as scikit-learn). */
const MOMENTUM_EARLY = 0.5;
const MOMENTUM_LATE = 0.8;
const GAIN_UP = 0.2;
const GAIN_DOWN = 0.8;
const MIN_GAIN = 0.01;

/**
 * t-SNE as init + step, with Barnes–Hut or FFT-interpolated repulsion (options.repulsion). `init()` (or driving `initSlices()` to the end) computes the
 * affinities and the start; each `step()` is one gradient-descent iteration with momentum and
 * per-coordinate gains. The KL cost is evaluated every 50 iterations and on the last one.
 * Same data, options and seed → identical coordinates.
 */
export class Tsne {
  readonly options: TsneOptions;
  readonly learningRate: number;
  /** The repulsion method in use ('auto' resolved by n). */
  readonly repulsion: 'fft' | 'barnes-hut';
  iteration = 0;
  /** KL(P ‖ Q) at the latest evaluation (un-exaggerated P), undefined before the first. */
  cost: number | undefined = undefined;
  private affinities: Affinities | null = null;
  private y: Float64Array = new Float64Array(0);
  private update = new Float64Array(0);
  private gains = new Float64Array(0);
  private grad = new Float64Array(0);
  private repel: Repulsion | null = null;
  private buf: GradientBuffers | null = null;

  constructor(
    private readonly data: Float64Array, readonly n: number, private readonly d: number,
    options: Partial<TsneOptions> = {},
  ) {
    this.options = resolveTsneOptions(options, n);
    this.learningRate = learningRateOf(this.options, n);
    this.repulsion = repulsionOf(this.options, n);
  }

  /** Prepares the run in one go (exact neighbours unless `given`). */
  init(given?: NeighbourInput): void {
    for (const fraction of this.initSlices(given)) void fraction;
  }

  /** Prepares the run in slices, yielding the fraction of the preparation done after each. */
  *initSlices(given?: NeighbourInput): Generator<number, void> {
    const prepared = yield* prepareTsne(this.data, this.n, this.d, this.options, given);
    yield 0.99;
    this.affinities = prepared.affinities;
    this.y = prepared.y;
    this.update = new Float64Array(2 * this.n);
    this.gains = new Float64Array(2 * this.n).fill(1);
    this.grad = new Float64Array(2 * this.n);
    this.repel = this.repulsion === 'fft' ? new FftRepulsion(this.n) : new BarnesHutRepulsion(this.n, this.options.theta);
    this.buf = gradientBuffers(this.n);
    // The pairs above P's diagonal, here rather than in the first step (a long one at large n).
    this.buf.pairs = { of: prepared.affinities, upper: upperPairs(prepared.affinities) };
    this.iteration = 0;
    this.cost = undefined;
  }

  /** One iteration; returns false, doing nothing, once all iterations are done. */
  step(): boolean {
    const parts = this.stepParts();
    for (;;) {
      const r = parts.next();
      if (r.done) return r.value;
    }
  }

  /**
   * One iteration in two parts, pausing (a yield) between the repulsion and the rest, so a driver
   * can checkpoint mid-step; returns false, doing nothing, once all iterations are done. The same
   * arithmetic as `step`.
   */
  *stepParts(): Generator<void, boolean> {
    const p = this.affinities;
    if (!p || !this.repel || !this.buf) throw new Error('t-SNE: call init() before step()');
    const o = this.options;
    if (this.iteration >= o.iterations) return false;
    const early = this.iteration < o.exaggerationIterations;
    if (this.iteration === o.exaggerationIterations && this.iteration > 0) {
      // A new descent phase starts from rest (common practice, as scikit-learn).
      this.update.fill(0);
      this.gains.fill(1);
    }
    const last = this.iteration + 1 === o.iterations;
    const wantCost = (this.iteration + 1) % COST_EVERY === 0 || last;
    const z = this.repel.compute(this.y, this.n, this.buf.repel);
    yield;
    const { cost } = gradientAfterRepulsion(this.y, p, z, early ? o.earlyExaggeration : 1, this.grad, this.buf, wantCost);
    if (cost !== undefined) this.cost = cost;
    const momentum = early ? MOMENTUM_EARLY : MOMENTUM_LATE;
    const { y, update, gains, grad } = this;
    const lr = this.learningRate;
    for (let t = 0; t < y.length; t++) {
      const g = grad[t];
      let gain = update[t] * g < 0 ? gains[t] + GAIN_UP : gains[t] * GAIN_DOWN;
      if (gain < MIN_GAIN) gain = MIN_GAIN;
      gains[t] = gain;
      update[t] = momentum * update[t] - lr * gain * g;
      y[t] += update[t];
    }
    this.iteration++;
    return true;
  }

  /** True once every iteration has run. */
  get finished(): boolean {
    return this.iteration >= this.options.iterations;
  }

  /** Current coordinates, n × 2 interleaved (a copy). */
  coords(): Float32Array {
    return Float32Array.from(this.y);
  }
}
