/**
 * An error in a user's input file. Every message names the file, and where known the row
 * (1-based, counting the header as row 1), the column, and what was expected, so that the user
 * can find and fix the problem.
 */
export interface InputErrorDetails {
  file: string;
  /** 1-based line number in the file (the header is row 1); omitted for whole-file problems. */
  row?: number;
  /** Column name, or "column N" (1-based) when the header has no usable name. */
  column?: string;
  /** What was expected, in words a user can act on. */
  expected: string;
  /** What was found instead, shortened. */
  found?: string;
}

export class InputError extends Error {
  readonly details: InputErrorDetails;

  constructor(details: InputErrorDetails) {
    super(formatInputError(details));
    this.name = 'InputError';
    this.details = details;
  }
}

export function formatInputError(d: InputErrorDetails): string {
  const where = [d.file];
  if (d.row !== undefined) where.push(`row ${d.row}`);
  if (d.column !== undefined) where.push(`column "${d.column}"`);
  const found = d.found !== undefined ? `, found ${JSON.stringify(shorten(d.found))}` : '';
  return `${where.join(', ')}: expected ${d.expected}${found}`;
}

function shorten(s: string): string {
  return s.length > 40 ? `${s.slice(0, 37)}...` : s;
}

/** Thrown by cooperative kernels when their job was cancelled. */
export class CancelledError extends Error {
  constructor() {
    super('cancelled');
    this.name = 'CancelledError';
  }
}

/** An invalid option value, rejected at the edge (CLI flags, job payloads). */
export class OptionError extends Error {
  constructor(name: string, value: unknown, expected: string) {
    super(`invalid ${name}: ${JSON.stringify(value)} (expected ${expected})`);
    this.name = 'OptionError';
  }
}
