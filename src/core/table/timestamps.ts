import type { TimeFormat } from './table';

// ISO 8601 calendar date, optionally with a time ('T' or one space) and a zone (Z, ±hh, ±hhmm, ±hh:mm).
const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?(Z|[+-]\d{2}(?::?\d{2})?)?)?$/;

/**
 * Seconds since 1970-01-01T00:00:00Z of an ISO 8601 date or date-time, or NaN when the text is not
 * one. A time without a zone designator is read as UTC (the file's own clock), so that the same
 * file gives the same numbers on every machine.
 */
export function parseIsoSeconds(text: string): number {
  const m = ISO.exec(text);
  if (!m) return NaN;
  const [, y, mo, d, h = '0', mi = '0', s = '0', frac, zone] = m;
  const month = Number(mo);
  const day = Number(d);
  const hour = Number(h);
  const minute = Number(mi);
  const second = Number(s);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(Number(y), month)) return NaN;
  if (hour > 24 || minute > 59 || second > 60 || (hour === 24 && (minute > 0 || second > 0))) return NaN;
  let t = Date.UTC(Number(y), month - 1, day, hour, minute, second) / 1000;
  if (frac) t += Number(`0.${frac}`);
  if (zone && zone !== 'Z') {
    const sign = zone[0] === '-' ? -1 : 1;
    const digits = zone.slice(1).replace(':', '');
    const offset = Number(digits.slice(0, 2)) * 3600 + Number(digits.slice(2, 4) || '0') * 60;
    t -= sign * offset;
  }
  return t;
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/**
 * Unit of a numeric time column, from its magnitude: epoch milliseconds are above 1e11 (1973 in
 * ms, year 5138 in seconds), so a median above that means milliseconds. Common practice.
 */
export function numericTimeUnit(values: ArrayLike<number>): TimeFormat {
  const sample: number[] = [];
  const step = Math.max(1, Math.floor(values.length / 1000));
  for (let i = 0; i < values.length; i += step) {
    const v = values[i];
    if (v === v) sample.push(Math.abs(v));
  }
  if (sample.length === 0) return 'seconds';
  sample.sort((a, b) => a - b);
  return sample[sample.length >> 1] > 1e11 ? 'milliseconds' : 'seconds';
}
