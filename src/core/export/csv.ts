/**
 * CSV text for exports: RFC 4180 quoting (a field is quoted when it holds a comma, a double quote,
 * CR or LF; quotes inside are doubled), "\n" line ends, and numbers formatted the same way on every
 * machine (no locale).
 */

/** Significant digits for computed values (coordinates, confidences, metrics). */
export const EXPORT_DIGITS = 7;

/**
 * A number as export text: `digits` significant digits, trailing zeros dropped, no locale, no
 * thousands separators; '' for NaN or ±Infinity (missing); -0 becomes "0". Integers up to 2^53
 * are written in full whatever `digits` is.
 */
export function formatNumber(value: number, digits: number = EXPORT_DIGITS): string {
  if (!Number.isFinite(value)) return '';
  if (Number.isSafeInteger(value)) return value === 0 ? '0' : String(value);
  const rounded = Number(value.toPrecision(digits));
  return rounded === 0 ? '0' : String(rounded);
}

/** One field as RFC 4180 text. */
export function csvField(value: string | number): string {
  const text = typeof value === 'number' ? formatNumber(value) : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A whole CSV document: header line, then one line per row, each ended by "\n". */
export function toCsv(header: string[], rows: (string | number)[][]): string {
  const lines = [header.map(csvField).join(',')];
  for (const row of rows) {
    if (row.length !== header.length) {
      throw new Error(`toCsv: row has ${row.length} fields, header has ${header.length}`);
    }
    lines.push(row.map(csvField).join(','));
  }
  return `${lines.join('\n')}\n`;
}

/** 12345 → "12,345": a thousands separator for reading, whatever the machine's locale. */
export function thousands(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}
