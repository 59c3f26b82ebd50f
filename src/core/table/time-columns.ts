import { roleFromName } from './roles';
import type { Table } from './table';
import { numericTimeUnit } from './timestamps';

/**
 * Marks numeric columns whose name says start or end (a time) with their unit, seconds or
 * milliseconds, read from the values' magnitude. ISO 8601 and typed timestamp columns keep theirs.
 */
export function annotateTimes(table: Table): Table {
  for (const c of table.columns) {
    if (c.kind !== 'numeric' || c.time) continue;
    const role = roleFromName(c.name);
    if (role === 'start' || role === 'end') c.time = numericTimeUnit(c.values);
  }
  return table;
}
