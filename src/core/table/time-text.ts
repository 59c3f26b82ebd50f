import { isoFromEpoch } from '../raw/civil-time';
import type { Column } from './table';

/** Unix seconds from 2001 on count as absolute times; smaller values are seconds into a recording. */
export const ABSOLUTE_FROM = 978_307_200;

/**
 * The one way the app shows a window's start or end: ISO 8601 in UTC ("2026-03-02T07:58:00Z",
 * with a fraction only when there is one) for absolute times, "12.5 s" for seconds into a recording.
 * The tables carry no time zone of their own (ISO 8601 text without a zone is read as UTC), so
 * UTC is the study's zone.
 */
export function timeText(seconds: number): string {
  if (!Number.isFinite(seconds)) return '(missing)';
  return seconds >= ABSOLUTE_FROM ? isoFromEpoch(seconds) : `${Number(seconds.toPrecision(12))} s`;
}

/** A time column's cell in seconds (milliseconds columns divided by 1,000); NaN when missing or not numeric. */
export function cellSeconds(column: Column, row: number): number {
  if (column.kind !== 'numeric') return NaN;
  const v = column.values[row];
  return column.time === 'milliseconds' ? v / 1000 : v;
}

/** A time column's cell as timeText shows it; a text column's cell as it is. */
export function cellTimeText(column: Column, row: number): string {
  if (column.kind !== 'numeric') {
    const code = column.codes[row];
    return code < 0 ? '(missing)' : column.dictionary[code];
  }
  return timeText(cellSeconds(column, row));
}
