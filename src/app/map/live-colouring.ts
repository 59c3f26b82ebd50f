import { packHex } from './raster';
import type { Colouring } from './colouring';

/** The one colour of live points that nothing colours yet (the live Map's former grey). */
export const LIVE_NEUTRAL = '#56606b';

/**
 * A colouring the live Map may borrow: `colouring.index[rowOf[w]]` colours input row (window) w;
 * rowOf[w] = -1 (or w past its end) when that source knows nothing of w.
 */
export interface LiveSource {
  colouring: Colouring;
  rowOf: Int32Array;
  /** Said in the legend title, e.g. "cluster of the previous run". */
  title: string;
}

/** rowOf for a source indexed by input row: identity over n rows. */
export function identityRows(n: number): Int32Array {
  return Int32Array.from({ length: n }, (_, i) => i);
}

/** rowOf for a run that analysed `windows` (its input rows, in order) out of `nInput`. */
export function rowsOfRun(windows: Int32Array | undefined, analysed: number, nInput: number): Int32Array {
  if (!windows) return identityRows(analysed);
  const rowOf = new Int32Array(Math.max(nInput, analysed)).fill(-1);
  for (let i = 0; i < windows.length; i++) rowOf[windows[i]] = i;
  return rowOf;
}

/**
 * Colours for the n live points (input rows `rows`, or 0..n-1 when null): the first source that
 * knows every one of them, else one neutral colour with a legend line saying why (`why`).
 */
export function liveColouring(n: number, rows: Int32Array | null, sources: readonly LiveSource[], why: string): Colouring {
  const rowOfPoint = (s: number) => (rows ? rows[s] : s);
  for (const source of sources) {
    const { rowOf, colouring } = source;
    const index = new Uint8Array(n);
    let covered = true;
    for (let s = 0; s < n && covered; s++) {
      const w = rowOfPoint(s);
      const r = w >= 0 && w < rowOf.length ? rowOf[w] : -1;
      if (r < 0 || r >= colouring.index.length) covered = false;
      else index[s] = colouring.index[r];
    }
    if (covered) return { index, palette: colouring.palette, legend: { ...colouring.legend, title: source.title } };
  }
  return {
    index: new Uint8Array(n),
    palette: Uint32Array.of(packHex(LIVE_NEUTRAL)),
    legend: { kind: 'categories', title: 'not coloured yet', entries: [{ name: why, colour: LIVE_NEUTRAL }] },
  };
}
