/** Replaces every NaN in `data` by `value` in place; returns how many were replaced. */
export function fillMissingInPlace(data: Float64Array, value: number): number {
  let filled = 0;
  for (let i = 0; i < data.length; i++) {
    if (data[i] !== data[i]) { data[i] = value; filled++; }
  }
  return filled;
}
