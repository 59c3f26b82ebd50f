import { timeText } from '../../../core/table/time-text';
import type { LinkWindow } from '../../../core/raw/link';
import type { Roles } from '../../../core/table/roles.types';
import { cellText, type Table } from '../../../core/table/table';
import { columnWithRole } from '../../lib/columns';

/** What the Traces view needs of one window: how to link it, and how to label it. */
export interface TraceWindow {
  /** Row of the current result (the index the selection and the Map use). */
  index: number;
  link: LinkWindow;
  /** Start in the app's one time format (timeText: ISO 8601 UTC, or seconds into a recording). */
  startText: string;
}


/**
 * The windows at the given result rows, or a sentence saying which column role is missing.
 * `rowOf` maps a result row to its table row (the recipe may have dropped windows).
 */
export function traceWindows(table: Table, roles: Roles, indices: readonly number[], rowOf: (i: number) => number): TraceWindow[] | string {
  const id = columnWithRole(table, roles, 'id');
  const subject = columnWithRole(table, roles, 'subject');
  const session = columnWithRole(table, roles, 'session');
  const start = columnWithRole(table, roles, 'start');
  const end = columnWithRole(table, roles, 'end');
  const duration = columnWithRole(table, roles, 'duration');
  if (!subject) return 'Traces need a subject column (set one in Column roles) to find each window\'s raw file.';
  if (!start || (!end && !duration)) return 'Traces need start and end (or duration) columns to find each window in its raw file.';
  return indices.map((index) => {
    const r = rowOf(index);
    const s = Number(cellText(start, r));
    const e = end ? Number(cellText(end, r)) : s + Number(cellText(duration!, r));
    const sess = session ? cellText(session, r) : '';
    return {
      index,
      link: { id: id ? cellText(id, r) : `row ${r + 2}`, subject: cellText(subject, r), ...(sess ? { session: sess } : {}), start: s, end: e },
      startText: timeText(s),
    };
  });
}
