import { formatNumber } from './csv';
import type { Roles, Role } from '../table/roles.types';
import { cellText, findColumn, type Column, type Table } from '../table/table';

/** Digits for times computed from start + duration: enough for epoch seconds with milliseconds. */
const TIME_DIGITS = 15;

/**
 * Per-window text of the columns that identify a window in exports (id, subject, session, start,
 * end), read through the column roles. A role with no column gives ''. Without an id column the
 * window's 0-based row index is its id. Without an end column, end = start + duration when both
 * are numeric.
 */
export interface WindowColumns {
  id(row: number): string;
  subject(row: number): string;
  session(row: number): string;
  start(row: number): string;
  end(row: number): string;
}

export function columnWithRole(table: Table, roles: Roles, role: Role): Column | undefined {
  const entry = roles.find((r) => r.role === role);
  return entry ? findColumn(table, entry.name) : undefined;
}

export function windowColumns(table: Table, roles: Roles): WindowColumns {
  const text = (role: Role): ((row: number) => string) => {
    const column = columnWithRole(table, roles, role);
    return column ? (row) => cellText(column, row) : () => '';
  };
  const idColumn = columnWithRole(table, roles, 'id');
  const start = columnWithRole(table, roles, 'start');
  const duration = columnWithRole(table, roles, 'duration');
  let end = text('end');
  if (!columnWithRole(table, roles, 'end') && start?.kind === 'numeric' && duration?.kind === 'numeric') {
    end = (row) => formatNumber(start.values[row] + duration.values[row], TIME_DIGITS);
  }
  return {
    id: idColumn ? (row) => cellText(idColumn, row) : (row) => String(row),
    subject: text('subject'),
    session: text('session'),
    start: text('start'),
    end,
  };
}
