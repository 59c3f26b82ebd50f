/** Rows per storage block of a growing column. */
export const BLOCK = 65536;

type Typed = Float32Array | Float64Array | Int32Array;

/** Rows 0..n-1 of a list of equally sized blocks; blocks null: n copies of `fill`. */
export interface Segment<T extends Typed> {
  blocks: T[] | null;
  n: number;
  fill?: number;
}

/** Joins equally sized blocks into one array of n values, dropping each block once copied. */
export function joinBlocks<T extends Typed>(blocks: T[], n: number, make: (n: number) => T): T {
  return joinSegments([{ blocks, n }], make);
}

/** Joins segments of blocks end to end into one array, dropping each block once copied. */
export function joinSegments<T extends Typed>(segments: Segment<T>[], make: (n: number) => T): T {
  const out = make(segments.reduce((s, g) => s + g.n, 0));
  let at = 0;
  for (const { blocks, n, fill } of segments) {
    if (!blocks) {
      out.fill(fill ?? 0, at, at + n);
      at += n;
      continue;
    }
    let done = 0;
    for (let b = 0; b < blocks.length && done < n; b++) {
      const take = Math.min(BLOCK, n - done);
      out.set(take === BLOCK ? blocks[b] : blocks[b].subarray(0, take), at + done);
      done += take;
      (blocks as (T | null)[])[b] = null;
    }
    blocks.length = 0;
    at += n;
  }
  return out;
}
