import { cellTimeText } from '../../core/table/time-text';
import type { Role, Roles } from '../../core/table/roles.types';
import { cellText, type Column, type Table } from '../../core/table/table';

/** The first column with the given role, if any. */
export function columnWithRole(table: Table, roles: Roles, role: Role): Column | undefined {
  const r = roles.find((c) => c.role === role);
  return r ? table.columns.find((c) => c.name === r.name) : undefined;
}

export interface Categories {
  /** Category index per row; missing values get their own category "(missing)". */
  codes: Int32Array;
  names: string[];
}

/** Groups a column's values into categories (numbers sorted ascending, text in first-seen order). */
export function categoriesOf(column: Column, nRows: number): Categories {
  const codes = new Int32Array(nRows);
  const index = new Map<string, number>();
  const names: string[] = [];
  const keys: string[] = new Array(nRows);
  for (let i = 0; i < nRows; i++) keys[i] = cellText(column, i);
  const order = column.kind === 'numeric'
    ? [...new Set(keys)].sort((a, b) => (a === '' ? 1 : b === '' ? -1 : Number(a) - Number(b)))
    : [...new Set(keys)].sort((a, b) => (a === '' ? 1 : b === '' ? -1 : 0));
  for (const key of order) {
    index.set(key, names.length);
    names.push(key === '' ? '(missing)' : key);
  }
  for (let i = 0; i < nRows; i++) codes[i] = index.get(keys[i])!;
  return { codes, names };
}

/** The short description of one window for the Map tooltip. */
export function describeWindow(table: Table, roles: Roles, row: number): { label: string; value: string }[] {
  const lines: { label: string; value: string }[] = [];
  const id = columnWithRole(table, roles, 'id');
  lines.push({ label: 'window', value: id ? cellText(id, row) : `row ${row + 2}` });
  const subject = columnWithRole(table, roles, 'subject');
  if (subject) lines.push({ label: 'subject', value: cellText(subject, row) || '(missing)' });
  // Start and end in the one time format of the app (ISO 8601, UTC).
  for (const role of ['start', 'end'] as const) {
    const c = columnWithRole(table, roles, role);
    if (c) lines.push({ label: role, value: cellTimeText(c, row) });
  }
  return lines;
}
