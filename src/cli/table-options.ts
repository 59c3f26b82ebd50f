import type { ParamSpec } from '../core/params';
import { DEFAULT_MISSING_MARKERS } from '../core/table/missing-markers';
import type { Notice } from '../core/table/notices';
import { ROLES, type Role, type RoleOverrides } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import type { CommandFlag, ParsedCommand } from './parse-command';
import { UsageError } from './usage-error';

/** How the default marker list reads in the usage text. */
const DEFAULT_SHOWN = DEFAULT_MISSING_MARKERS.map((m) => (m === '' ? "''" : m)).join(' ');

/** `--na <list>`: the cells read as missing in a text table. */
export const NA: ParamSpec<string> = {
  name: 'na', flag: 'na', meta: '<list>', kind: 'text', default: DEFAULT_MISSING_MARKERS.join(','),
  help: ['cells read as missing, separated by commas (default', `${DEFAULT_SHOWN}; --na '' = only empty cells)`],
};

/** `--role <column=role>`: a column's role, as the app's roles menu sets it. */
export const ROLE: ParamSpec<string> = {
  name: 'role', flag: 'role', meta: '<col=role>', kind: 'text', default: '',
  help: ['set a column\'s role, as the app\'s roles menu does (repeatable); roles:', `${ROLES.join(', ')}`],
};

/** The two flags as a command lists them. */
export const TABLE_FLAGS: readonly CommandFlag[] = [{ spec: NA, emptyValue: true }, { spec: ROLE, repeatable: true }];

/** The missing-value markers of `--na`, or undefined (the default list) when it was not given. */
export function naOption(parsed: ParsedCommand): string[] | undefined {
  const text = parsed.texts.get(NA.flag);
  if (text === undefined) return undefined;
  const list = text.split(',').map((m) => m.trim());
  const bad = list.find((m) => /["\r\n]/.test(m));
  if (bad !== undefined) throw new UsageError(`--na: the marker ${JSON.stringify(bad)} may not hold a double quote or line break`);
  return list;
}

/** The roles given by `--role column=role` (each column once); the columns are checked against the table later. */
export function roleOption(parsed: ParsedCommand): RoleOverrides | undefined {
  const given = parsed.lists.get(ROLE.flag);
  if (!given) return undefined;
  const out: RoleOverrides = {};
  for (const text of given) {
    const eq = text.lastIndexOf('=');
    const column = eq < 0 ? '' : text.slice(0, eq).trim();
    const role = eq < 0 ? '' : text.slice(eq + 1).trim();
    if (column === '' || role === '') throw new UsageError(`--role ${JSON.stringify(text)}: expected <column>=<role>, for example --role "subject id=subject"`);
    if (!ROLES.includes(role as Role)) throw new UsageError(`--role ${JSON.stringify(text)}: unknown role "${role}" (expected one of ${ROLES.join(', ')})`);
    if (column in out && out[column] !== role) throw new UsageError(`--role: column "${column}" given two roles (${out[column]} and ${role})`);
    out[column] = role as Role;
  }
  return out;
}

/** Fails with a usage error when a `--role` column is not in the table (named, with the table's columns). */
export function checkRoleColumns(table: Table, overrides: RoleOverrides | undefined): void {
  if (!overrides) return;
  const names = new Set(table.columns.map((c) => c.name));
  for (const column of Object.keys(overrides)) {
    if (!names.has(column)) {
      const list = table.columns.map((c) => c.name);
      const shown = list.length > 12 ? `${list.slice(0, 12).join(', ')}, … (${list.length} in all)` : list.join(', ');
      throw new UsageError(`--role: no column "${column}" in ${table.fileName} (columns: ${shown})`);
    }
  }
}

/** Lines printed of one kind of notice before the rest are counted in one line (a wide table has hundreds). */
export const PRINTED_PER_KIND = 12;

/**
 * One line each on stderr; past PRINTED_PER_KIND of one kind, one line counts the rest and says
 * where they are all listed (`listedIn`, for example "summary.json").
 */
export function printNotices(notices: readonly Notice[], listedIn?: string, out: { write(s: string): unknown } = process.stderr): void {
  const seen = new Map<string, number>();
  for (const n of notices) {
    const k = (seen.get(n.kind) ?? 0) + 1;
    seen.set(n.kind, k);
    if (k <= PRINTED_PER_KIND) out.write(`gleaner: note: ${n.message}\n`);
  }
  for (const [kind, k] of seen) {
    if (k > PRINTED_PER_KIND) out.write(`gleaner: note: ${k - PRINTED_PER_KIND} more notices of this kind (${kind})${listedIn ? `, all listed in ${listedIn}` : ''}\n`);
  }
}
