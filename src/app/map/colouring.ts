import { timeText } from '../../core/table/time-text';
import type { Roles } from '../../core/table/roles.types';
import type { Column, Table } from '../../core/table/table';
import { categoriesOf, columnWithRole } from '../lib/columns';
import { CATEGORY_COLOURS, MISSING_COLOUR, VALUE_COLOURS, hexOf, viridis } from '../lib/palette';
import { packHex, packRGBA } from './raster';

/** What the Map's points are coloured by. */
export type ColourBy = 'cluster' | 'subject' | 'time' | `label:${string}` | `metadata:${string}` | `feature:${string}`;

export interface CategoryLegend {
  kind: 'categories';
  title: string;
  /** Cluster legends also give each entry's number (as exported) and composition flags with their reasons. */
  entries: { name: string; colour: string; number?: number; flags?: { text: string; reason: string }[] }[];
}

export interface ScaleLegend {
  kind: 'scale';
  title: string;
  min: string;
  max: string;
  /** CSS colours from min to max, for a gradient bar. */
  stops: string[];
  /** Windows without a value (drawn light grey). */
  missing: number;
}

/** Point colours for the Map: a palette index per point, the packed palette and the legend. */
export interface Colouring {
  index: Uint8Array;
  palette: Uint32Array;
  legend: CategoryLegend | ScaleLegend;
}

const N_CAT = CATEGORY_COLOURS.length;
/** Category palette: the category colours, then the missing colour. */
const CATEGORY_PALETTE = Uint32Array.from([...CATEGORY_COLOURS, MISSING_COLOUR].map(packHex));
/** Values of a column (subject, label, metadata) never take a cluster colour (palette.ts VALUE_COLOURS). */
const N_VAL = VALUE_COLOURS.length;
const VALUE_PALETTE = Uint32Array.from([...VALUE_COLOURS, MISSING_COLOUR].map(packHex));
/** Scale palette: 255 viridis steps, then the missing colour. */
const SCALE_STEPS = 255;
const SCALE_PALETTE = Uint32Array.from([
  ...Array.from({ length: SCALE_STEPS }, (_, i) => packRGBA(...viridis(i / (SCALE_STEPS - 1)))),
  packHex(MISSING_COLOUR),
]);

/**
 * Colours by category codes (negative = missing). Categories beyond the palette reuse its colours
 * in turn, so the index array is always one byte per window.
 */
export function categoryColouring(codes: Int32Array, names: string[], title: string, missingCode = -1, of: 'clusters' | 'values' = 'clusters'): Colouring {
  const colours = of === 'clusters' ? CATEGORY_COLOURS : VALUE_COLOURS;
  const n = of === 'clusters' ? N_CAT : N_VAL;
  const index = new Uint8Array(codes.length);
  for (let i = 0; i < codes.length; i++) {
    const c = codes[i];
    index[i] = c < 0 || c === missingCode ? n : c % n;
  }
  const entries = names.map((name, c) => ({ name, colour: c === missingCode ? MISSING_COLOUR : colours[c % n] }));
  return { index, palette: of === 'clusters' ? CATEGORY_PALETTE : VALUE_PALETTE, legend: { kind: 'categories', title, entries } };
}

/** Colours numeric values on viridis from their minimum to their maximum; NaN = missing. */
export function scaleColouring(values: Float32Array | Float64Array, title: string, format: (v: number) => string = formatValue): Colouring {
  let min = Infinity, max = -Infinity, missing = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v !== v) { missing++; continue; }
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const k = (SCALE_STEPS - 1) / (max > min ? max - min : 1);
  const index = new Uint8Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    // v !== v: NaN (missing); the step is rounded half up (values are ≥ min).
    index[i] = v !== v ? SCALE_STEPS : ((v - min) * k + 0.5) | 0;
  }
  const stops = Array.from({ length: 9 }, (_, i) => hexOf(viridis(i / 8)));
  const none = missing === values.length;
  return {
    index,
    palette: SCALE_PALETTE,
    legend: { kind: 'scale', title, min: none ? '–' : format(min), max: none ? '–' : format(max), stops, missing },
  };
}

export function formatValue(v: number): string {
  return Math.abs(v) >= 1e5 || (v !== 0 && Math.abs(v) < 1e-3) ? v.toExponential(2) : String(Number(v.toPrecision(4)));
}

/** Start times on the legend, in the app's one time format (timeText; milliseconds columns in seconds first). */
export function formatTime(v: number): string {
  return timeText(v > 1e11 ? v / 1000 : v);
}

function columnColouring(column: Column, nRows: number, title: string, format?: (v: number) => string): Colouring {
  if (column.kind === 'numeric' && format) return scaleColouring(column.values, title, format);
  const cats = categoriesOf(column, nRows);
  const missing = cats.names.length > 0 && cats.names[cats.names.length - 1] === '(missing)' ? cats.names.length - 1 : -1;
  return categoryColouring(cats.codes, cats.names, title, missing, 'values');
}

/**
 * The Map's colouring: by cluster, subject, start time, or a named label, metadata or feature
 * column. Falls back to clusters when the column is gone (for example after a role change).
 */
export function colouring(by: ColourBy, labels: Int32Array, k: number, names: (c: number) => string, table: Table, roles: Roles): Colouring {
  const n = labels.length;
  if (by === 'subject' || by === 'time') {
    const column = columnWithRole(table, roles, by === 'subject' ? 'subject' : 'start');
    if (column) return columnColouring(column, n, by, by === 'time' ? formatTime : undefined);
  } else if (by !== 'cluster') {
    const sep = by.indexOf(':');
    const kind = by.slice(0, sep), name = by.slice(sep + 1);
    const column = table.columns.find((c) => c.name === name);
    if (column) return columnColouring(column, n, name, kind === 'feature' ? formatValue : undefined);
  }
  return categoryColouring(labels, Array.from({ length: k }, (_, c) => names(c)), 'cluster');
}
