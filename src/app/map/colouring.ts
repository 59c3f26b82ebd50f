import type { Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';
import { categoriesOf, columnWithRole } from '../lib/columns';
import { categoryColour } from '../lib/palette';
import type { ColourBy } from '../state/map.svelte';

export interface Colouring {
  colourOf: Int32Array;
  colours: string[];
  /** Legend entries, one per colour. */
  names: string[];
}

/** Point colours for the Map: by cluster, or by subject when the table has a subject column. */
export function colouring(by: ColourBy, labels: Int32Array, k: number, names: (c: number) => string, table: Table, roles: Roles): Colouring {
  const subject = by === 'subject' ? columnWithRole(table, roles, 'subject') : undefined;
  if (subject) {
    const cats = categoriesOf(subject, table.nRows);
    return { colourOf: cats.codes, colours: cats.names.map((_, i) => categoryColour(i)), names: cats.names };
  }
  const ks = Array.from({ length: k }, (_, c) => c);
  return { colourOf: labels, colours: ks.map(categoryColour), names: ks.map(names) };
}
