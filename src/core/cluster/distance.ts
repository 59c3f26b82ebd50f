/** Squared Euclidean distance between a[ao .. ao + d) and b[bo .. bo + d). */
export function squaredDistance(a: ArrayLike<number>, ao: number, b: ArrayLike<number>, bo: number, d: number): number {
  let s = 0;
  for (let j = 0; j < d; j++) {
    const t = a[ao + j] - b[bo + j];
    s += t * t;
  }
  return s;
}
