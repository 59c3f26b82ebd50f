import type { Trace } from './reader';

export interface Cell {
  trace: Trace;
  group: string;
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface Layout {
  cells: Cell[];
  titles: { text: string; x: number; y: number }[];
  height: number;
}

export const CELL = { minWidth: 260, height: 118, gap: 10, title: 24, pad: 10 } as const;

/** Small multiples in rows, one titled section per group (selection, typical, borderline). */
export function layoutMultiples(sections: readonly { title: string; group: string; traces: readonly Trace[] }[], width: number): Layout {
  const usable = Math.max(CELL.minWidth, width - 2 * CELL.pad);
  const cols = Math.max(1, Math.floor((usable + CELL.gap) / (CELL.minWidth + CELL.gap)));
  const w = (usable - (cols - 1) * CELL.gap) / cols;
  const cells: Cell[] = [];
  const titles: Layout['titles'] = [];
  let y = CELL.pad;
  for (const s of sections) {
    titles.push({ text: s.title, x: CELL.pad, y: y + 15 });
    y += CELL.title;
    s.traces.forEach((trace, i) => {
      const c = i % cols, r = Math.floor(i / cols);
      cells.push({ trace, group: s.group, x: CELL.pad + c * (w + CELL.gap), y: y + r * (CELL.height + CELL.gap), w, h: CELL.height });
    });
    y += Math.ceil(s.traces.length / cols) * (CELL.height + CELL.gap) + 4;
  }
  return { cells, titles, height: y + CELL.pad };
}

/** The cell under a point, or null. */
export function cellAt(layout: Layout, x: number, y: number): Cell | null {
  return layout.cells.find((c) => x >= c.x && x < c.x + c.w && y >= c.y && y < c.y + c.h) ?? null;
}

/** Lowest and highest finite sample of the drawn channels of one trace (null when none). */
export function traceRange(trace: Trace): [number, number] | null {
  if (trace.state !== 'ok') return null;
  let lo = Infinity, hi = -Infinity;
  for (const ch of trace.span.channels) {
    for (const v of ch.samples) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return lo <= hi ? [lo, hi] : null;
}

/** The y range of each trace: its own, or one shared by all (common scale); padded 5 %. */
export function yRanges(traces: readonly Trace[], common: boolean): ([number, number] | null)[] {
  const own = traces.map(traceRange);
  let shared: [number, number] | null = null;
  if (common) {
    for (const r of own) if (r) shared = shared ? [Math.min(shared[0], r[0]), Math.max(shared[1], r[1])] : [r[0], r[1]];
  }
  return own.map((r) => {
    const base = common ? shared : r;
    if (!base) return null;
    const pad = base[1] > base[0] ? (base[1] - base[0]) * 0.05 : Math.max(1e-6, Math.abs(base[0]) * 0.05 || 1);
    return [base[0] - pad, base[1] + pad];
  });
}
