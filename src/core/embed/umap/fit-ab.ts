/**
 * The low-dimensional similarity curve 1 / (1 + a·x^(2b)) fitted by least squares to the target
 * "1 up to minDist, then exp(−(x − minDist) / spread)" on 300 evenly spaced points of [0, 3·spread],
 * as UMAP defines it. Solved by Levenberg–Marquardt from (a, b) = (1, 1) with the analytic Jacobian.
 */
export function fitAB(spread: number, minDist: number): { a: number; b: number } {
  const m = 300;
  const xs = new Float64Array(m);
  const ys = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const x = (3 * spread * i) / (m - 1);
    xs[i] = x;
    ys[i] = x < minDist ? 1 : Math.exp(-(x - minDist) / spread);
  }
  let a = 1;
  let b = 1;
  let lambda = 1e-3;
  let cost = residualCost(xs, ys, a, b);
  for (let iter = 0; iter < 500; iter++) {
    // Normal equations J^T J δ = −J^T r for the 2 parameters.
    let jaa = 0, jab = 0, jbb = 0, ga = 0, gb = 0;
    for (let i = 0; i < m; i++) {
      const x = xs[i];
      const p = x > 0 ? Math.pow(x, 2 * b) : 0;
      const den = 1 + a * p;
      const r = 1 / den - ys[i];
      const da = -p / (den * den);
      const db = x > 0 ? (-a * p * 2 * Math.log(x)) / (den * den) : 0;
      jaa += da * da; jab += da * db; jbb += db * db;
      ga += da * r; gb += db * r;
    }
    let improved = false;
    for (let tries = 0; tries < 30 && !improved; tries++) {
      const maa = jaa * (1 + lambda);
      const mbb = jbb * (1 + lambda);
      const det = maa * mbb - jab * jab;
      if (!(Math.abs(det) > 0)) { lambda *= 10; continue; }
      const stepA = (-ga * mbb + gb * jab) / det;
      const stepB = (-gb * maa + ga * jab) / det;
      const na = a + stepA;
      const nb = b + stepB;
      const nc = na > 0 && nb > 0 ? residualCost(xs, ys, na, nb) : Infinity;
      if (nc < cost) {
        const small = Math.abs(stepA) <= 1e-12 * (1 + Math.abs(a)) && Math.abs(stepB) <= 1e-12 * (1 + Math.abs(b));
        a = na; b = nb;
        const drop = cost - nc;
        cost = nc;
        lambda = Math.max(lambda / 10, 1e-12);
        improved = true;
        if (small || drop <= 1e-15 * cost) return { a, b };
      } else {
        lambda *= 10;
      }
    }
    if (!improved) break;
  }
  return { a, b };
}

function residualCost(xs: Float64Array, ys: Float64Array, a: number, b: number): number {
  let s = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i];
    const p = x > 0 ? Math.pow(x, 2 * b) : 0;
    const r = 1 / (1 + a * p) - ys[i];
    s += r * r;
  }
  return s;
}
