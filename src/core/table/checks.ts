import { InputError } from '../errors';
import { roleFromName } from './roles';
import type { Roles } from './roles.types';
import { rowLine, type Column, type Table } from './table';

/** Something a user should know about a table that does not stop the analysis. */
export interface TableWarning {
  column: string;
  message: string;
}

function key(c: Column, r: number): number | string | null {
  if (c.kind === 'numeric') return c.values[r] === c.values[r] ? c.values[r] : null;
  return c.codes[r] < 0 ? null : c.codes[r];
}

function show(c: Column, k: number | string): string {
  return c.kind === 'categorical' ? c.dictionary[k as number] : String(k);
}

/**
 * Checks the table against its roles: the window id column (by role, or by a name such as
 * "window_id" whose values are mostly but not all unique) must not repeat an id; subjects with a
 * single window are reported as warnings (per-subject scaling and subject statistics need more).
 */
export function checkTable(table: Table, roles: Roles): TableWarning[] {
  const byName = new Map(table.columns.map((c) => [c.name, c]));
  const idRole = roles.find((r) => r.role === 'id');
  // A column the user set to "ignore" is not held to uniqueness; one left out as identifier-like is.
  const userIgnored = (name: string) => roles.some((r) => r.name === name && r.role === 'ignore' && r.evidence === 'set by you');
  const idColumn = idRole ? byName.get(idRole.name) : table.columns.find((c) => roleFromName(c.name) === 'id' && !userIgnored(c.name));
  if (idColumn) checkUniqueIds(table, idColumn, idRole !== undefined);

  const warnings: TableWarning[] = [];
  const subjectRole = roles.find((r) => r.role === 'subject');
  const subject = subjectRole ? byName.get(subjectRole.name) : undefined;
  if (subject) {
    const counts = new Map<number | string, { n: number; row: number }>();
    for (let r = 0; r < table.nRows; r++) {
      const k = key(subject, r);
      if (k === null) continue;
      const e = counts.get(k);
      if (e) e.n++;
      else counts.set(k, { n: 1, row: r });
    }
    const single = [...counts].filter(([, e]) => e.n === 1);
    if (single.length > 0 && counts.size > 1) {
      const list = single.slice(0, 5).map(([k, e]) => `"${show(subject, k)}" (row ${rowLine(table, e.row)})`).join(', ');
      const more = single.length > 5 ? ` and ${single.length - 5} more` : '';
      warnings.push({
        column: subject.name,
        message: `${table.fileName}, column "${subject.name}": ${single.length} subject${single.length === 1 ? ' has' : 's have'} only one window: ${list}${more}; per-subject scaling and subject statistics need at least two windows per subject`,
      });
    }
  }
  return warnings;
}

function checkUniqueIds(table: Table, c: Column, byRole: boolean): void {
  const seen = new Map<number | string, number>();
  let firstDup: [number, number] | null = null;
  for (let r = 0; r < table.nRows; r++) {
    const k = key(c, r);
    if (k === null) continue;
    const first = seen.get(k);
    if (first !== undefined) {
      firstDup ??= [first, r];
      if (byRole) break;
    } else seen.set(k, r);
  }
  if (!firstDup) return;
  // A column only named like an id is held to uniqueness when it looks like one: mostly unique values.
  if (!byRole && seen.size <= table.nRows / 2) return;
  const [a, b] = firstDup;
  throw new InputError({
    file: table.fileName, row: rowLine(table, b), column: c.name,
    expected: 'a unique window id on every row',
    found: `"${show(c, key(c, b) as number | string)}" again (first on row ${rowLine(table, a)})`,
  });
}
