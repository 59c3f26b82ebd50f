import type { Roles } from './roles.types';
import type { Table } from './table';

/** What kind of automatic decision a notice tells. */
export type NoticeKind =
  | 'missing-cells'
  | 'id-like'
  | 'window-id'
  | 'duplicate-ids'
  | 'duplicate-names'
  | 'column-ignored'
  | 'feature-constant'
  | 'feature-dropped'
  | 'cells-filled'
  | 'cells-made-missing'
  | 'rows-dropped'
  | 'windows-without-subject';

/**
 * An automatic decision made about the input, told to the user (the CLI prints one line each on
 * stderr; summary.json lists them as `notices`). Unlike an InputError it does not stop the run.
 */
export interface Notice {
  kind: NoticeKind;
  /** The column it concerns, when it concerns one. */
  column?: string;
  /** The count it reports (cells, rows, distinct values), when it reports one. */
  count?: number;
  /** One line for a person: names the file and the column. */
  message: string;
}

/** 5418 → "5,418" (the same in every locale, so outputs do not depend on the machine). */
export function grouped(n: number): string {
  const s = String(Math.abs(Math.trunc(n)));
  const out = s.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return n < 0 ? `-${out}` : out;
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${grouped(n)} ${n === 1 ? one : many}`;
}

/**
 * One notice per column with missing cells: the count, and for a text table the markers it was
 * written with ('615 of 5,418 cells read as missing: 612 "?", 3 empty'). Given the roles, label
 * columns (partial by design) and ignored ones are left out.
 */
export function missingNotices(table: Table, roles?: Roles): Notice[] {
  const byColumn = new Map((table.missing ?? []).map((m) => [m.column, m]));
  const skip = new Set((roles ?? []).filter((r) => r.role === 'label' || r.role === 'ignore').map((r) => r.name));
  const out: Notice[] = [];
  for (const c of table.columns) {
    if (skip.has(c.name)) continue;
    let n = 0;
    if (c.kind === 'numeric') {
      for (let r = 0; r < table.nRows; r++) if (c.values[r] !== c.values[r]) n++;
    } else {
      for (let r = 0; r < table.nRows; r++) if (c.codes[r] < 0) n++;
    }
    if (n === 0) continue;
    const counts = byColumn.get(c.name);
    const how = counts
      ? `: ${Object.entries(counts.byMarker).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1)).map(([m, k]) => `${grouped(k)} ${m === '' ? 'empty' : `"${m}"`}`).join(', ')}`
      : '';
    out.push({
      kind: 'missing-cells', column: c.name, count: n,
      message: `${table.fileName}, column "${c.name}": ${grouped(n)} of ${plural(table.nRows, 'cell')} read as missing${how}`,
    });
  }
  return out;
}
