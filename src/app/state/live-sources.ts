import type { Run } from '../../core/run/run.types';
import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';
import { colouring, type ColourBy, type Colouring } from '../map/colouring';
import { identityRows, rowsOfRun, type LiveSource } from '../map/live-colouring';

export interface LiveSourceInput {
  /** The run shown when the new one starts, and its curated colouring (null when none). */
  previous: Run | null;
  curated: Colouring | null;
  /** Windows (input rows) of the new run's matrix. */
  nInput: number;
  colourBy: ColourBy;
  table: Table;
  roles: Roles;
}

/**
 * What a live map may be coloured by, in order: the previous run's curated clusters (used only if
 * it analysed every live window), then the chosen colour-by when it is a column (one pass over
 * it); and the legend line for when neither applies.
 */
export function liveSources(input: LiveSourceInput): { sources: LiveSource[]; why: string } {
  const sources: LiveSource[] = [];
  const { previous, curated } = input;
  if (previous && curated) {
    const rowOf = rowsOfRun(previous.result.windows, previous.result.labels.length, input.nInput);
    sources.push({ colouring: curated, rowOf, title: 'cluster of the previous run' });
  }
  if (input.colourBy !== 'cluster') {
    const c = colouring(input.colourBy, new Int32Array(input.table.nRows), 0, () => '', input.table, input.roles);
    if (c.legend.title !== 'cluster') sources.push({ colouring: c, rowOf: identityRows(input.table.nRows), title: c.legend.title });
  }
  const why = !previous
    ? 'one colour: no previous run to borrow clusters from'
    : 'one colour: the previous run analysed other windows';
  return { sources, why };
}
