import { OptionError } from '../errors';
import { parseNumberBytes } from './number-bytes';

/**
 * Cells of a text table read as missing by default (compared exactly, case included, after the
 * cell's surrounding spaces are trimmed). The empty cell is always missing, whatever the list.
 * The list is the loading options' `missing` (ReadOptions) and the CLI's `--na`.
 */
export const DEFAULT_MISSING_MARKERS: readonly string[] = ['', 'NA', 'N/A', 'NaN', 'nan', 'null', 'NULL', '?', '-'];

/** Whether a marker would be read as a number, with a decimal point or a decimal comma. */
function readsAsNumber(m: string): boolean {
  if (m === '') return false;
  const b = new TextEncoder().encode(m);
  return !Number.isNaN(parseNumberBytes(b, 0, b.length, 0x2e)) || !Number.isNaN(parseNumberBytes(b, 0, b.length, 0x2c));
}

/** A list of missing-value markers, ready for matching cells against it. */
export class MissingMarkers {
  /** The markers, the empty cell first, each once. */
  readonly list: readonly string[];
  /** True when a marker reads as a number ("-999"): then every cell is matched before it is parsed. */
  readonly numeric: boolean;
  private readonly index: Map<string, number>;
  private readonly longest: number;

  constructor(markers: readonly string[] = DEFAULT_MISSING_MARKERS) {
    const list = [''];
    for (const m of markers) {
      if (typeof m !== 'string') throw new OptionError('missing-value markers', m, 'text values');
      if (/[\r\n"]/.test(m)) throw new OptionError('missing-value marker', m, 'text without line breaks or double quotes');
      const t = m.trim();
      if (!list.includes(t)) list.push(t);
    }
    this.list = list;
    this.index = new Map(list.map((m, i) => [m, i]));
    this.longest = Math.max(...list.map((m) => m.length));
    this.numeric = list.some(readsAsNumber);
  }

  /** Index in `list` of a trimmed cell that is a marker, or -1. */
  indexOf(cell: string): number {
    if (cell.length > this.longest) return -1;
    return this.index.get(cell) ?? -1;
  }

  /** The first marker besides the empty cell, for messages ("write NA for a missing value"). */
  get example(): string | undefined {
    return this.list[1];
  }
}

/** Missing cells of one column of a text table, by marker (only markers seen). */
export interface MissingCount {
  column: string;
  /** Cells read as missing. */
  total: number;
  /** Marker as written ('' for the empty cell) → cells. */
  byMarker: Record<string, number>;
}
