/** Binary-search tolerance on the entropy (nats) and step limit (common practice). */
const ENTROPY_TOL = 1e-5;
const MAX_STEPS = 200;

/**
 * Conditional probabilities p(j|i) ∝ exp(−β_i d²_ij) over each window's k nearest neighbours, with
 * β_i found by binary search so that the entropy of row i equals ln(perplexity). `sqDistances` is
 * row-major n × k squared distances; the result has the same shape and each row sums to 1.
 * Distances are shifted by the row's smallest one before exponentiating (the normalised
 * distribution is unchanged) so that large distances cannot underflow to an all-zero row.
 */
export function conditionalProbabilities(
  sqDistances: Float64Array, n: number, k: number, perplexity: number, from = 0, to = n,
  out: Float64Array = new Float64Array(n * k),
): Float64Array {
  const target = Math.log(perplexity);
  for (let i = from; i < to; i++) {
    const o = i * k;
    let dmin = Infinity;
    for (let t = 0; t < k; t++) dmin = Math.min(dmin, sqDistances[o + t]);
    let beta = 1;
    let lo = 0;
    let hi = Infinity;
    for (let step = 0; step < MAX_STEPS; step++) {
      let sum = 0;
      let weighted = 0;
      for (let t = 0; t < k; t++) {
        const dd = sqDistances[o + t] - dmin;
        const p = Math.exp(-beta * dd);
        out[o + t] = p;
        sum += p;
        weighted += dd * p;
      }
      // H = ln Σ p + β Σ d² p / Σ p, for p not yet normalised.
      const entropy = Math.log(sum) + (beta * weighted) / sum;
      for (let t = 0; t < k; t++) out[o + t] /= sum;
      const diff = entropy - target;
      if (Math.abs(diff) <= ENTROPY_TOL) break;
      if (diff > 0) { lo = beta; beta = hi === Infinity ? beta * 2 : (beta + hi) / 2; }
      else { hi = beta; beta = (beta + lo) / 2; }
    }
  }
  return out;
}
