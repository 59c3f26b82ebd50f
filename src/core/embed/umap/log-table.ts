/**
 * A positive function of x > 0 tabulated on a log-spaced grid (256 points per octave over
 * [2^−40, 2^40)) and read by linear interpolation (relative error ~1e-5, below 2e-5, for the smooth power laws
 * of the layout's gradients). Reading it costs a few table loads instead of a Math.pow, which
 * dominates the layout's inner loop. `tableAt` returns −1 outside the grid: callers then evaluate
 * the function itself. Deterministic: the table depends only on the function.
 */
const MANTISSA_BITS = 8;
const SLOTS = 1 << MANTISSA_BITS;
const LOW_BITS = 20 - MANTISSA_BITS;
const LOW_MASK = (1 << LOW_BITS) - 1;
const LOW_SCALE = 1 / (1 << LOW_BITS);
const EXP_MIN = -40;
const EXP_MAX = 40;

const scratch = new Float64Array(1);
const words = new Uint32Array(scratch.buffer);
/** Index of the 32-bit word holding sign, exponent and the top mantissa bits. */
const HIGH = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

export function buildLogTable(f: (x: number) => number): Float64Array {
  const values = new Float64Array((EXP_MAX - EXP_MIN) * SLOTS + 1);
  for (let e = EXP_MIN; e < EXP_MAX; e++) {
    for (let m = 0; m < SLOTS; m++) values[(e - EXP_MIN) * SLOTS + m] = f(2 ** e * (1 + m / SLOTS));
  }
  values[values.length - 1] = f(2 ** EXP_MAX);
  return values;
}

/** The tabulated value at x, or −1 when x is outside [2^−40, 2^40). */
export function tableAt(values: Float64Array, x: number): number {
  scratch[0] = x;
  const hi = words[HIGH];
  const e = ((hi >>> 20) & 0x7ff) - 1023;
  if (e < EXP_MIN || e >= EXP_MAX) return -1;
  const idx = ((e - EXP_MIN) << MANTISSA_BITS) | ((hi >>> LOW_BITS) & (SLOTS - 1));
  const v0 = values[idx];
  return v0 + (hi & LOW_MASK) * LOW_SCALE * (values[idx + 1] - v0);
}
