/** Exact powers of ten representable in a double (10^0 .. 10^22). */
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);
const MAX_EXACT = 2 ** 53;

/**
 * Parses a decimal number written in bytes[s, e) (already trimmed): [+-]digits[.digits][e[+-]digits],
 * with `point` (0x2e '.' or 0x2c ',') as the decimal mark. Returns NaN when the cell is not such a
 * number. Results equal Number(text): the fast path is exact (an integer mantissa below 2^53 scaled
 * by an exact power of ten is correctly rounded by IEEE-754), everything else goes through Number().
 */
export function parseNumberBytes(b: Uint8Array, s: number, e: number, point: number): number {
  let i = s;
  let neg = false;
  const c0 = b[i];
  if (c0 === 0x2d || c0 === 0x2b) { neg = c0 === 0x2d; i++; }
  let mant = 0;
  let scale = 0;
  let intDigits = 0;
  while (i < e) {
    const d = b[i] - 0x30;
    if (d < 0 || d > 9) break;
    mant = mant * 10 + d;
    i++; intDigits++;
  }
  let digits = intDigits;
  let fracDigits = 0;
  if (i < e && b[i] === point) {
    i++;
    while (i < e) {
      const d = b[i] - 0x30;
      if (d < 0 || d > 9) break;
      mant = mant * 10 + d;
      i++; fracDigits++;
    }
    digits += fracDigits;
    scale = fracDigits;
  }
  if (digits === 0) return NaN;
  let exp = 0;
  if (i < e) {
    const c = b[i];
    if (c !== 0x65 && c !== 0x45) return NaN;
    i++;
    let eneg = false;
    if (i < e && (b[i] === 0x2d || b[i] === 0x2b)) { eneg = b[i] === 0x2d; i++; }
    let ed = 0;
    while (i < e) {
      const d = b[i] - 0x30;
      if (d < 0 || d > 9) return NaN;
      exp = exp * 10 + d;
      i++; ed++;
    }
    if (ed === 0) return NaN;
    if (eneg) exp = -exp;
  }
  const p = exp - scale;
  if (mant < MAX_EXACT && p >= -22 && p <= 22) {
    const v = p < 0 ? mant / POW10[-p] : mant * POW10[p];
    return neg ? -v : v;
  }
  return slowParse(b, s, e, point);
}

function slowParse(b: Uint8Array, s: number, e: number, point: number): number {
  let t = '';
  for (let i = s; i < e; i++) t += String.fromCharCode(b[i] === point ? 0x2e : b[i]);
  return Number(t);
}
