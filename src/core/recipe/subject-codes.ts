import type { Column } from '../table/table';

export interface SubjectCodes {
  /** Code per window, -1 where the subject is missing. */
  codes: Int32Array;
  /** Subject name of each code. */
  names: string[];
}

/**
 * Subject codes of a subject column, for subject-scoped recipe steps and the data-quality
 * report: a text column keeps its dictionary order; a numeric column is coded by ascending value.
 */
export function subjectCodes(column: Column): SubjectCodes {
  if (column.kind === 'categorical') return { codes: Int32Array.from(column.codes), names: [...column.dictionary] };
  const v = column.values;
  const distinct = [...new Set(Array.from(v).filter((x) => x === x))].sort((a, b) => a - b);
  const index = new Map(distinct.map((x, c) => [x, c]));
  return { codes: Int32Array.from(v, (x) => (x === x ? index.get(x)! : -1)), names: distinct.map(String) };
}
