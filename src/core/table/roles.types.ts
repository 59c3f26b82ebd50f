/** What a column of a windows table is for. */
export type Role =
  | 'id'
  | 'subject'
  | 'session'
  | 'start'
  | 'end'
  | 'duration'
  | 'feature'
  | 'label'
  | 'metadata'
  | 'ignore';

export const ROLES: readonly Role[] = [
  'id', 'subject', 'session', 'start', 'end', 'duration', 'feature', 'label', 'metadata', 'ignore',
];

export interface ColumnRole {
  name: string;
  role: Role;
  /** Why the role was inferred, in a few words a user can check ("12 distinct text values"). */
  evidence: string;
}

/** One entry per column, in table order. */
export type Roles = ColumnRole[];

/** User overrides: column name → role. */
export type RoleOverrides = Record<string, Role>;
