import type { Roles } from '../table/roles.types';
import type { Column, Table } from '../table/table';

/**
 * The windows a recipe kept, as a table of their own (for exports of a run that dropped windows).
 * Without an id column, windows are known by their 0-based row number in the input; a numeric
 * column holding that number is added with the role "id" so exported ids keep pointing at input rows.
 */
export function keepRows(table: Table, roles: Roles, rows: Int32Array): { table: Table; roles: Roles } {
  const columns: Column[] = table.columns.map((c) =>
    c.kind === 'numeric'
      ? { ...c, values: Float64Array.from(rows, (i) => c.values[i]) }
      : { ...c, codes: Int32Array.from(rows, (i) => c.codes[i]) });
  let outRoles = roles;
  if (!roles.some((r) => r.role === 'id')) {
    let name = 'row';
    while (columns.some((c) => c.name === name)) name = `${name}_`;
    columns.push({ kind: 'numeric', name, values: Float64Array.from(rows) });
    outRoles = [...roles, { name, role: 'id', evidence: 'row number in the input (the recipe dropped windows)' }];
  }
  return { table: { ...table, nRows: rows.length, columns }, roles: outRoles };
}
