export interface LogEffect {
  transformed: number;
  /** log1p of a value at or below -1 is undefined: such values become missing. */
  madeMissing: number;
}

/**
 * Log transform in place of the listed columns: 'log1p' is ln(1 + x) (values <= -1 become
 * missing), 'signed-log' is sign(x) ln(1 + |x|), defined everywhere and odd.
 */
export function logInPlace(data: Float64Array, n: number, d: number, columns: number[], mode: 'log1p' | 'signed-log'): LogEffect {
  let transformed = 0;
  let madeMissing = 0;
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (const j of columns) {
      const x = data[o + j];
      if (x !== x) continue;
      if (mode === 'log1p') {
        if (x <= -1) { data[o + j] = NaN; madeMissing++; continue; }
        data[o + j] = Math.log1p(x);
      } else {
        data[o + j] = x < 0 ? -Math.log1p(-x) : Math.log1p(x);
      }
      transformed++;
    }
  }
  return { transformed, madeMissing };
}
