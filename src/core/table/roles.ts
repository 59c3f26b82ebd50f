import { OptionError } from '../errors';
import { grouped, type Notice } from './notices';
import { ROLES, type ColumnRole, type Role, type RoleOverrides, type Roles } from './roles.types';
import type { CategoricalColumn, Column, NumericColumn, Table } from './table';

/** Words in a column name that suggest a role (matched against the name's words). */
const NAME_WORDS: [Role, readonly string[]][] = [
  ['subject', ['subject', 'subj', 'participant', 'pid', 'user', 'patient', 'person', 'volunteer', 'wearer']],
  ['session', ['session', 'visit', 'recording']],
  ['start', ['start', 't0', 'begin', 'onset', 'timestamp']],
  ['end', ['end', 'stop', 't1']],
  ['duration', ['duration', 'dur']],
  ['label', ['label', 'labels', 'activity', 'class', 'annotation', 'target', 'truth', 'behaviour', 'behavior']],
  ['id', ['id', 'window', 'win', 'uuid', 'uid', 'idx', 'index', 'row', 'rowid', 'rownum']],
  ['metadata', ['device', 'placement', 'site', 'group', 'location', 'sensor', 'lab', 'cohort', 'condition', 'sex', 'gender', 'environment']],
  ['ignore', ['note', 'notes', 'comment', 'comments', 'remark', 'remarks', 'description']],
];

/** A numeric column with at most this many distinct values may be a label or metadata code. */
const MAX_CODES = 20;

/** Roles at most one column may hold; a second candidate falls back to a general role. */
const SINGULAR: ReadonlySet<Role> = new Set(['id', 'subject', 'session', 'start', 'end', 'duration']);

/** Splits "windowStartS" / "t_start" / "Subject ID" into lower-case words. */
export function nameWords(name: string): string[] {
  return name
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((w) => w !== '');
}

/** The role a column's name suggests, if any (earlier entries in NAME_WORDS win). */
export function roleFromName(name: string): Role | undefined {
  const words = nameWords(name);
  for (const [role, list] of NAME_WORDS) if (words.some((w) => list.includes(w))) return role;
  return undefined;
}

interface Profile {
  missing: number;
  distinct: number;
  /** Number of runs of equal consecutive non-missing values. */
  runs: number;
}

function profile(column: Column, nRows: number): Profile {
  let missing = 0;
  let runs = 0;
  let prev = NaN;
  let prevMissing = true;
  if (column.kind === 'categorical') {
    // Codes index the dictionary: distinct values are the codes in use.
    const used = new Uint8Array(column.dictionary.length);
    let distinct = 0;
    for (let r = 0; r < nRows; r++) {
      const v = column.codes[r];
      if (v < 0) {
        missing++;
        prevMissing = true;
        continue;
      }
      if (prevMissing || v !== prev) runs++;
      prev = v;
      prevMissing = false;
      if (used[v] === 0) {
        used[v] = 1;
        distinct++;
      }
    }
    return { missing, distinct, runs };
  }
  const seen = new NumberSet(nRows);
  const values = column.values;
  for (let r = 0; r < nRows; r++) {
    const v = values[r];
    if (v !== v) {
      missing++;
      prevMissing = true;
      continue;
    }
    if (prevMissing || v !== prev) runs++;
    prev = v;
    prevMissing = false;
    seen.add(v);
  }
  return { missing, distinct: seen.size, runs };
}

/**
 * MurmurHash3's 32-bit finalizer: every input bit reaches the low bits used as the slot index
 * (whole numbers have long runs of zero bits at the bottom of their pattern).
 */
function mix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

/**
 * A set of numbers (no NaN; -0 counts as 0, as in a JavaScript Set) in open addressing over the
 * values' bits: a Set<number> took about half a second per million distinct values, which made
 * role inference of a 1,000,000-window table take longer than reading it.
 */
class NumberSet {
  size = 0;
  private readonly keys: Float64Array;
  private readonly used: Uint8Array;
  private readonly mask: number;
  private readonly bits = new Float64Array(1);
  private readonly words = new Int32Array(this.bits.buffer);

  constructor(most: number) {
    let n = 16;
    while (n < 2 * most) n *= 2;
    this.keys = new Float64Array(n);
    this.used = new Uint8Array(n);
    this.mask = n - 1;
  }

  add(value: number): void {
    const v = value + 0;
    this.bits[0] = v;
    let i = mix32(this.words[0] ^ Math.imul(this.words[1], 0x9e3779b1)) & this.mask;
    while (this.used[i] === 1) {
      if (this.keys[i] === v) return;
      i = (i + 1) & this.mask;
    }
    this.used[i] = 1;
    this.keys[i] = v;
    this.size++;
  }
}

function describe(column: Column, p: Profile, nRows: number): string {
  const kind = column.kind === 'numeric' ? 'numeric' : 'text';
  const parts = [`${p.distinct} distinct ${kind} value${p.distinct === 1 ? '' : 's'}`];
  if (p.distinct > 1 && p.distinct < nRows && p.runs <= 2 * p.distinct) parts[0] += ', in runs';
  if (p.distinct === nRows - p.missing && p.distinct > 1) parts[0] += ', all unique';
  if (p.missing > 0) parts.push(`${Math.round((100 * p.missing) / nRows)}% missing`);
  return parts.join('; ');
}

/**
 * How an integer column's values look like a window identifier, in a few words, or null: a
 * sequence (each value one more than the one before), counting up by 1 in runs that restart
 * (a per-subject or per-recording counter), or near-unique integers that fill their range
 * (a shuffled row number). Only the present values count; fewer than MIN_ID_ROWS never look so.
 */
function identifierShape(values: Float32Array | Float64Array, p: Profile, present: number): string | null {
  if (present < MIN_ID_ROWS) return null;
  let prev = NaN;
  let plusOne = 0;
  let steps = 0;
  let lo = Infinity;
  let hi = -Infinity;
  for (let r = 0; r < values.length; r++) {
    const v = values[r];
    if (v !== v) continue;
    if (!Number.isInteger(v)) return null;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
    if (prev === prev) {
      steps++;
      if (v === prev + 1) plusOne++;
    }
    prev = v;
  }
  if (plusOne === steps) return 'a sequence of integers counting up by 1';
  if (plusOne >= RUN_SHARE * steps) return `integers counting up by 1 in runs (${grouped(steps - plusOne)} restarts)`;
  if (p.distinct >= NEAR_UNIQUE * present && hi - lo + 1 <= DENSE_SPAN * present) return `near-unique integers filling ${grouped(lo)}..${grouped(hi)}`;
  return null;
}

/** Fewest present values an identifier is recognised from by its values. */
const MIN_ID_ROWS = 10;
/** Share of steps of +1 that makes "counting up in runs". */
const RUN_SHARE = 0.9;
/** Share of distinct values that makes "near-unique", and the widest range (× rows) they may fill. */
const NEAR_UNIQUE = 0.95;
const DENSE_SPAN = 1.1;

/** Words that name an identifier by themselves ("window" also begins feature names such as window_steps). */
const ID_WORDS: ReadonlySet<string> = new Set(['id', 'uid', 'uuid', 'idx', 'index', 'row', 'rowid', 'rownum']);

/** True when a column's name says "identifier": an id word, or the name is just "window" / "win". */
function namedLikeId(name: string): boolean {
  const words = nameWords(name);
  return words.some((w) => ID_WORDS.has(w)) || (words.length === 1 && (words[0] === 'window' || words[0] === 'win'));
}

function isIntegerColumn(values: Float32Array | Float64Array): boolean {
  for (let r = 0; r < values.length; r++) {
    const v = values[r];
    if (v === v && !Number.isInteger(v)) return false;
  }
  return true;
}

function inferOne(column: Column, nRows: number, taken: Set<Role>, notices: Notice[], fileName: string, idColumn: () => string | undefined): ColumnRole {
  const p = profile(column, nRows);
  const facts = describe(column, p, nRows);
  const named = roleFromName(column.name);
  const free = (r: Role) => !(SINGULAR.has(r) && taken.has(r));
  const say = (role: Role, why: string): ColumnRole => {
    if (SINGULAR.has(role)) taken.add(role);
    return { name: column.name, role, evidence: why ? `${why}; ${facts}` : facts };
  };
  const present = nRows - p.missing;
  // An empty column is kept as a feature (unless its name says otherwise) so that featureMatrix
  // reports it by name rather than the analysis silently running without it.
  if (present === 0) return say(named && free(named) ? named : 'feature', 'no values at all');
  const unique = p.distinct === present && present > 1;
  const repeated = p.distinct < present;

  // An integer column whose name or values say "identifier" is the window id when unique, and is
  // otherwise left out of the features, with a notice: clustering on a row counter is never meant.
  if (column.kind === 'numeric' && column.time === undefined && (named === undefined || named === 'id') && present > 1 && isIntegerColumn(column.values)) {
    const shape = identifierShape(column.values, p, present);
    const byName = named === 'id' && namedLikeId(column.name);
    if (byName || shape !== null) {
      const why = [byName ? `name "${column.name}"` : '', shape ?? ''].filter((w) => w !== '').join(', ');
      if (unique && free('id')) {
        if (!byName) {
          notices.push({ kind: 'window-id', column: column.name, message: `${fileName}, column "${column.name}": ${shape}, one per row: used as the window id` });
        }
        return say('id', why);
      }
      const held = unique
        ? `is unique while "${idColumn() ?? ''}" is the window id`
        : `holds ${grouped(p.distinct)} distinct value${p.distinct === 1 ? '' : 's'} in ${grouped(nRows)} rows${p.missing > 0 ? ` (${grouped(p.missing)} missing)` : ''}`;
      const message = `${fileName}, column "${column.name}" looks like an identifier (${why}) but ${held}; not used as a feature`;
      notices.push({ kind: 'id-like', column: column.name, count: p.distinct, message });
      return say('ignore', `looks like an identifier (${why}); not used as a feature`);
    }
  }

  if (named && free(named)) {
    const byName = `name "${column.name}"`;
    switch (named) {
      case 'id':
        if (unique) return say('id', byName);
        break;
      case 'subject':
      case 'session':
        if (repeated || column.kind === 'categorical') return say(named, byName);
        break;
      case 'start':
      case 'end':
      case 'duration':
        if (column.kind === 'numeric' || named !== 'duration') return say(named, `${byName}, time`);
        break;
      case 'label':
      case 'metadata':
        // A numeric column only by name when it holds a few codes, not a measurement.
        if (column.kind === 'categorical' || p.distinct <= MAX_CODES) return say(named, byName);
        break;
      case 'ignore':
        notices.push({ kind: 'column-ignored', column: column.name, message: `${fileName}, column "${column.name}": not used (its name says free text)` });
        return say('ignore', `${byName}, free text`);
    }
  }
  if (named === 'id' && column.kind === 'categorical' && repeated && p.distinct <= nRows / 2) {
    // Mostly repeated values are no window id (checkTable refuses a mostly-unique one that repeats).
    notices.push({
      kind: 'duplicate-ids', column: column.name, count: p.distinct,
      message: `${fileName}, column "${column.name}" is named like a window id but repeats its values (${grouped(p.distinct)} distinct in ${grouped(nRows)} rows); not used as the window id`,
    });
  }
  if (column.kind === 'categorical') return inferText(column, p, present, unique, free, say);
  return inferNumber(column, p, unique, free, say);
}

function inferText(
  _c: CategoricalColumn, p: Profile, present: number, unique: boolean,
  free: (r: Role) => boolean, say: (r: Role, why: string) => ColumnRole,
): ColumnRole {
  if (unique && free('id')) return say('id', 'text, one value per row');
  if (p.missing > present) return say('label', 'text, mostly missing');
  return say('metadata', 'text');
}

function inferNumber(
  c: NumericColumn, _p: Profile, unique: boolean,
  free: (r: Role) => boolean, say: (r: Role, why: string) => ColumnRole,
): ColumnRole {
  if (unique && free('id') && isCounter(c.values)) return say('id', 'integers counting up by 1');
  return say('feature', 'numeric');
}

/** True when the values are consecutive integers 0,1,2,... or 1,2,3,... (a row counter). */
function isCounter(v: Float32Array | Float64Array): boolean {
  if (v.length < 2 || (v[0] !== 0 && v[0] !== 1)) return false;
  for (let i = 1; i < v.length; i++) if (v[i] !== v[i - 1] + 1) return false;
  return true;
}

/**
 * Infers each column's role from its name and content, with a short evidence string. User
 * overrides (column name → role) win and are applied first, so an inferred column never takes
 * a one-per-table role (id, subject, session, start, end, duration) an override already holds.
 */
export function inferRoles(table: Table, overrides: RoleOverrides = {}): Roles {
  return inferRolesTold(table, overrides).roles;
}

/** inferRoles, and the notices of the decisions a user should hear about (identifier columns). */
export function inferRolesTold(table: Table, overrides: RoleOverrides = {}): { roles: Roles; notices: Notice[] } {
  const names = new Set(table.columns.map((c) => c.name));
  for (const [name, role] of Object.entries(overrides)) {
    if (!names.has(name)) throw new OptionError('role override column', name, `a column of ${table.fileName}`);
    if (!ROLES.includes(role)) throw new OptionError(`role for "${name}"`, role, `one of ${ROLES.join(', ')}`);
  }
  const taken = new Set<Role>(Object.values(overrides).filter((r) => SINGULAR.has(r)));
  const notices: Notice[] = [];
  const roles: Roles = [];
  // The id column so far, or the one an override names (for a notice on a second id-like column).
  const idColumn = () => roles.find((r) => r.role === 'id')?.name ?? Object.entries(overrides).find(([, r]) => r === 'id')?.[0];
  for (const column of table.columns) {
    const role = overrides[column.name];
    roles.push(role !== undefined ? { name: column.name, role, evidence: 'set by you' } : inferOne(column, table.nRows, taken, notices, table.fileName, idColumn));
  }
  return { roles, notices };
}
