import { daysInMonth, epochFromCivil } from '../civil-time';

const ISO = /^(\d{4})-(\d\d)-(\d\d)[T ](\d\d):(\d\d)(?::(\d\d)(\.\d+)?)?(Z|[+-]\d\d:?\d\d)?$/;
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Unix seconds at and above which a numeric time is read as absolute (1973-03-03; common practice for sensor logs). */
export const ABSOLUTE_SECONDS = 1e8;

/** Seconds of an ISO 8601 date-time (UTC when no offset is given), or NaN when `text` is not one. */
export function parseIsoSeconds(text: string): number {
  const m = ISO.exec(text);
  if (!m) return NaN;
  const [year, month, day, hour, minute] = [1, 2, 3, 4, 5].map((i) => Number(m[i]));
  const second = m[6] === undefined ? 0 : Number(m[6]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) || hour > 23 || minute > 59 || second > 60) return NaN;
  let zone = 0;
  if (m[8] && m[8] !== 'Z') {
    const z = m[8].replace(':', '');
    zone = (z[0] === '-' ? -1 : 1) * (Number(z.slice(1, 3)) * 3600 + Number(z.slice(3, 5)) * 60);
  }
  return epochFromCivil({ year, month, day, hour, minute, second, subsecond: m[7] ? Number(m[7]) : 0 }) - zone;
}

export type TimeFormat = 'seconds' | 'iso';

/** The format of a time cell: plain seconds or ISO 8601, or null when it is neither. */
export function timeFormatOf(text: string): TimeFormat | null {
  if (NUMBER.test(text)) return 'seconds';
  return Number.isNaN(parseIsoSeconds(text)) ? null : 'iso';
}

export function parseTime(text: string, format: TimeFormat): number {
  if (format === 'iso') return parseIsoSeconds(text);
  return NUMBER.test(text) ? Number(text) : NaN;
}
