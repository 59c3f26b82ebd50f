/**
 * Distance kernels for the nearest-centre loops (k-means assignment and seeding). Each squared
 * distance is summed in feature order exactly as `squaredDistance` does (t = a − b; s += t·t), so
 * results are bit-identical; speed comes from working on four centres at once, which gives the
 * processor four independent sums instead of one long chain.
 */

/**
 * Squared distances from row `o` of `data` (d features) to the k rows of `centres` (row-major
 * k × d), written to `out[0 .. k)`.
 */
export function distancesToCentres(data: Float64Array, o: number, d: number, centres: Float64Array, k: number, out: Float64Array): void {
  let c = 0;
  for (; c + 4 <= k; c += 4) {
    const c0 = c * d;
    const c1 = c0 + d;
    const c2 = c1 + d;
    const c3 = c2 + d;
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      const t0 = x - centres[c0 + j];
      const t1 = x - centres[c1 + j];
      const t2 = x - centres[c2 + j];
      const t3 = x - centres[c3 + j];
      s0 += t0 * t0;
      s1 += t1 * t1;
      s2 += t2 * t2;
      s3 += t3 * t3;
    }
    out[c] = s0;
    out[c + 1] = s1;
    out[c + 2] = s2;
    out[c + 3] = s3;
  }
  if (c + 2 <= k) {
    const c0 = c * d;
    const c1 = c0 + d;
    let s0 = 0;
    let s1 = 0;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      const t0 = x - centres[c0 + j];
      const t1 = x - centres[c1 + j];
      s0 += t0 * t0;
      s1 += t1 * t1;
    }
    out[c] = s0;
    out[c + 1] = s1;
    c += 2;
  }
  if (c < k) {
    const c0 = c * d;
    let s0 = 0;
    for (let j = 0; j < d; j++) {
      const t0 = data[o + j] - centres[c0 + j];
      s0 += t0 * t0;
    }
    out[c] = s0;
  }
}

/**
 * Nearest and second-nearest centre of row `o`: out[0] = index (ties to the lower index),
 * out[1] = its squared distance, out[2] = the second smallest squared distance. `scratch` holds k values.
 */
export function nearestTwo(
  data: Float64Array, o: number, d: number, centres: Float64Array, k: number, scratch: Float64Array, out: Float64Array,
): void {
  distancesToCentres(data, o, d, centres, k, scratch);
  let best = 0;
  let d1 = Infinity;
  let d2 = Infinity;
  for (let c = 0; c < k; c++) {
    const dist = scratch[c];
    if (dist < d1) { d2 = d1; d1 = dist; best = c; } else if (dist < d2) d2 = dist;
  }
  out[0] = best;
  out[1] = d1;
  out[2] = d2;
}
