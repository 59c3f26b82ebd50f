/**
 * Deterministic number printing for the demo CSVs: 6 significant digits, shortest form, never
 * exponent notation (tiny values fall back to fixed point), '' for a missing value.
 */
export function formatFeature(v: number): string {
  if (!Number.isFinite(v)) return '';
  if (v === 0) return '0';
  const s = String(Number(v.toPrecision(6)));
  if (!s.includes('e')) return s;
  const fixed = v.toFixed(12).replace(/0+$/, '').replace(/\.$/, '');
  return fixed === '-0' || fixed === '0' ? '0' : fixed;
}
