/** What per-subject z-scoring did, for the recipe record. */
export interface SubjectZScoreEffect {
  /** Groups scaled: one per subject code, plus one for windows without a subject when there are any. */
  groups: number;
  /** Windows without a subject (code < 0), scaled together as one group. */
  windowsWithoutSubject: number;
  /** (group, feature) pairs with zero spread or no values, set to 0. */
  constantCells: number;
}

export interface SubjectScaled {
  /** Scaled copy, row-major n × d; missing values stay NaN. */
  data: Float64Array;
  effect: SubjectZScoreEffect;
}

/**
 * Z-scores each feature within each subject: (x - subject mean) / subject sd, ddof 0, missing
 * values (NaN) left out of both and kept NaN. A feature with zero spread within a subject becomes
 * 0 for that subject. Windows with a negative subject code (no subject) form one group of their
 * own. This removes each subject's offset and scale, so clusters that only mark a person (a
 * loosely worn watch, a different device) fade. The input is not modified.
 */
export function subjectZscore(input: ArrayLike<number>, n: number, d: number, subjects: ArrayLike<number>): SubjectScaled {
  if (input.length !== n * d) throw new Error(`matrix shape does not fit its data: n = ${n}, d = ${d}, ${input.length} values`);
  if (subjects.length !== n) throw new Error(`expected ${n} subject codes (one per window), got ${subjects.length}`);
  const data = Float64Array.from(input);
  const groupOf = new Int32Array(n);
  const ids = new Map<number, number>();
  let withoutSubject = 0;
  for (let i = 0; i < n; i++) {
    const s = subjects[i] < 0 ? -1 : subjects[i];
    if (s < 0) withoutSubject++;
    let g = ids.get(s);
    if (g === undefined) { g = ids.size; ids.set(s, g); }
    groupOf[i] = g;
  }
  const groups = ids.size;
  const sums = new Float64Array(groups * d);
  const counts = new Float64Array(groups * d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    const go = groupOf[i] * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { sums[go + j] += x; counts[go + j]++; }
    }
  }
  const means = new Float64Array(groups * d);
  for (let c = 0; c < means.length; c++) means[c] = counts[c] > 0 ? sums[c] / counts[c] : 0;
  // Second pass on deviations (two-pass variance, stable for large offsets).
  const ss = new Float64Array(groups * d);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    const go = groupOf[i] * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) { const dx = x - means[go + j]; ss[go + j] += dx * dx; }
    }
  }
  const scale = new Float64Array(groups * d);
  let constantCells = 0;
  for (let c = 0; c < scale.length; c++) {
    const sd = counts[c] > 0 ? Math.sqrt(ss[c] / counts[c]) : 0;
    // Spread at rounding level relative to the mean counts as constant.
    if (sd > 1e-12 * Math.max(1, Math.abs(means[c]))) scale[c] = 1 / sd;
    else constantCells++;
  }
  for (let i = 0; i < n; i++) {
    const o = i * d;
    const go = groupOf[i] * d;
    for (let j = 0; j < d; j++) {
      const x = data[o + j];
      if (x === x) data[o + j] = scale[go + j] === 0 ? 0 : (x - means[go + j]) * scale[go + j];
    }
  }
  return { data, effect: { groups, windowsWithoutSubject: withoutSubject, constantCells } };
}
