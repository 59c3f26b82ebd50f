import { addCovarianceRows, columnMeans, finishCovariance } from '../covariance';
import { pca, pcaAxes, project } from '../pca';
import { OptionError } from '../../errors';
import { exactKnnSearch } from '../../neighbors/exact';
import type { Knn } from '../../neighbors/knn.types';
import { normal, seededRandom } from '../../random';
import { symmetrizeSteps, type Affinities } from './affinities';
import type { TsneOptions } from './options';
import { conditionalProbabilities } from './perplexity';

/** Standard deviation of the first initial coordinate (common practice: 1e-4). */
const INIT_SD = 1e-4;
/** Jitter added to the PCA start, relative to INIT_SD: separates duplicate windows, varies with the seed. */
const JITTER = 0.01;
/** Rows per slice of the neighbour search and of the perplexity calibration. */
const SLICE = 512;

export interface Prepared {
  affinities: Affinities;
  /** Initial coordinates, n × 2 interleaved. */
  y: Float64Array;
}

/** Reduced data and their neighbour graph, when the driver searched the neighbours itself. */
export interface NeighbourInput {
  x: Float64Array;
  dim: number;
  knn: Knn;
}

/**
 * Everything before the first gradient step, as a generator that yields the fraction done after
 * each slice of work (so a driver may checkpoint between slices): optional PCA pre-reduction,
 * neighbours (given, with more than `perplexity` per window; or searched exactly here with
 * k = min(n − 1, ⌊3 · perplexity⌋ + 1)),
 * perplexity calibration, symmetrisation, and the initial coordinates.
 */
export function* prepareTsne(
  data: Float64Array, n: number, d: number, o: TsneOptions, given?: NeighbourInput,
): Generator<number, Prepared> {
  const { x, dim } = given ?? reduceForTsne(data, n, d, o);
  yield 0.02;
  let knn = given?.knn;
  const k = knn ? knn.k : neighboursFor(o.perplexity, n);
  if (!knn) {
    const search = exactKnnSearch(x, n, dim, k, 'euclidean');
    for (let from = 0; from < n; from += SLICE) {
      search.rows(from, Math.min(n, from + SLICE));
      yield 0.02 + 0.9 * (Math.min(n, from + SLICE) / n);
    }
    knn = search.finish();
  }
  const fewest = Math.min(n - 1, Math.ceil(o.perplexity) + 1);
  if (knn.n !== n || knn.k < fewest || knn.k > n - 1) {
    throw new OptionError('neighbour graph', `${knn.n} × ${knn.k}`, `${n} rows of ${fewest} to ${n - 1} neighbours`);
  }
  const sq = new Float64Array(n * k);
  for (let t = 0; t < sq.length; t++) sq[t] = knn.distances[t] * knn.distances[t];
  const conditional = new Float64Array(n * k);
  for (let from = 0; from < n; from += SLICE) {
    conditionalProbabilities(sq, n, k, o.perplexity, from, Math.min(n, from + SLICE), conditional);
    yield 0.92 + 0.03 * (Math.min(n, from + SLICE) / n);
  }
  const sym = symmetrizeSteps(knn.indices, conditional, n, k);
  let step = sym.next();
  while (!step.done) {
    yield 0.95 + 0.02 * step.value;
    step = sym.next();
  }
  const affinities = step.value;
  yield 0.97;
  const y = yield* initialCoordinates(x, n, dim, o);
  return { affinities, y };
}

/** Neighbours per window for the affinities: min(n − 1, ⌊3 · perplexity⌋ + 1) (common practice). */
export function neighboursFor(perplexity: number, n: number): number {
  return Math.min(n - 1, Math.floor(3 * perplexity) + 1);
}

/**
 * Neighbours per window searched by NN-descent: min(n − 1, ⌊1.5 · perplexity⌋ + 1) (46 at the
 * default 30). The Gaussian calibrated to the perplexity puts little weight past 1.5 · perplexity
 * neighbours, and the search costs grow steeply with k (measured: see docs/embeddings.md).
 */
export function approximateNeighboursFor(perplexity: number, n: number): number {
  return Math.min(n - 1, Math.max(Math.ceil(perplexity) + 1, Math.floor(1.5 * perplexity) + 1));
}

/** Checks the data are finite and projects them onto `pcaDimensions` principal axes when d is larger. */
export function reduceForTsne(data: Float64Array, n: number, d: number, o: TsneOptions): { x: Float64Array; dim: number } {
  if (data.length < n * d) throw new OptionError('data length', data.length, `at least n × d = ${n * d}`);
  for (let t = 0; t < n * d; t++) {
    if (!Number.isFinite(data[t])) {
      throw new OptionError(`value of window ${Math.floor(t / d) + 1}, feature ${(t % d) + 1}`, data[t], 'a finite number (fill missing values first)');
    }
  }
  if (d <= o.pcaDimensions) return { x: data, dim: d };
  return { x: pca(data, n, d, o.pcaDimensions).scores, dim: o.pcaDimensions };
}

/**
 * 'pca': the first two principal-axis scores scaled so that the first has standard deviation 1e-4
 * (common practice), plus seeded N(0, (0.01 · 1e-4)²) jitter; 'random': N(0, 1e-4²) per coordinate.
 */
export function* initialCoordinates(x: Float64Array, n: number, d: number, o: TsneOptions): Generator<number, Float64Array> {
  const random = seededRandom(o.seed);
  const y = new Float64Array(2 * n);
  if (o.init === 'random') {
    for (let t = 0; t < 2 * n; t++) y[t] = INIT_SD * normal(random);
    return y;
  }
  // The covariance is summed a slice of rows at a time so that a driver can checkpoint (the
  // same sums as pca's single pass).
  const mean = columnMeans(x, n, d);
  const sums = new Float64Array(d * d);
  for (let from = 0; from < n; from += 8 * SLICE) {
    addCovarianceRows(x, d, mean, from, Math.min(n, from + 8 * SLICE), sums);
    yield 0.97 + 0.02 * (Math.min(n, from + 8 * SLICE) / n);
  }
  const axes = pcaAxes(finishCovariance(sums, d, n), mean, n, d, 2);
  const c = axes.nComponents;
  const scores = project(x, n, d, mean, axes.components, c);
  let ss = 0;
  for (let i = 0; i < n; i++) ss += scores[i * c] ** 2;
  const sd = Math.sqrt(ss / n);
  const scale = sd > 0 ? INIT_SD / sd : 0;
  for (let i = 0; i < n; i++) {
    for (let a = 0; a < 2; a++) {
      const score = a < c ? scores[i * c + a] : 0;
      y[2 * i + a] = score * scale + JITTER * INIT_SD * normal(random);
    }
  }
  return y;
}
