import { describe, expect, it } from 'vitest';
import type { Colouring } from '../../../src/app/map/colouring';
import { identityRows, LIVE_NEUTRAL, liveColouring, rowsOfRun } from '../../../src/app/map/live-colouring';
import { packHex } from '../../../src/app/map/raster';

const legend = { kind: 'categories', title: 'cluster', entries: [{ name: 'a', colour: '#000000' }] } as const;
const source = (index: number[], rowOf: Int32Array, title: string) => ({
  colouring: { index: Uint8Array.from(index), palette: Uint32Array.of(1, 2, 3), legend: { ...legend, entries: [...legend.entries] } } as Colouring,
  rowOf, title,
});

describe('liveColouring', () => {
  it('colours sampled live points by the row each one names', () => {
    const prev = source([0, 1, 2, 0, 1], identityRows(5), 'cluster of the previous run');
    const c = liveColouring(3, Int32Array.of(4, 2, 0), [prev], 'why');
    expect([...c.index]).toEqual([1, 2, 0]);
    expect(c.legend.title).toBe('cluster of the previous run');
    expect(c.palette).toBe(prev.colouring.palette);
  });

  it('maps through a previous run that analysed only some windows, and falls to the next source when it misses one', () => {
    // The previous run kept input rows 1, 3, 4 of 5 (its rows 0, 1, 2).
    const rowOf = rowsOfRun(Int32Array.of(1, 3, 4), 3, 5);
    expect([...rowOf]).toEqual([-1, 0, -1, 1, 2]);
    const prev = source([2, 1, 0], rowOf, 'previous');
    expect([...liveColouring(2, Int32Array.of(3, 4), [prev], 'why').index]).toEqual([1, 0]);
    const column = source([0, 1, 0, 1, 0], identityRows(5), 'subject');
    const c = liveColouring(5, null, [prev, column], 'why');
    expect(c.legend.title).toBe('subject');
    expect([...c.index]).toEqual([0, 1, 0, 1, 0]);
  });

  it('is one neutral colour with the reason as its legend line when no source knows every point', () => {
    const prev = source([0, 1], identityRows(2), 'previous');
    const c = liveColouring(3, null, [prev], 'one colour: the previous run analysed other windows');
    expect([...c.index]).toEqual([0, 0, 0]);
    expect([...c.palette]).toEqual([packHex(LIVE_NEUTRAL)]);
    expect(c.legend).toEqual({ kind: 'categories', title: 'not coloured yet', entries: [{ name: 'one colour: the previous run analysed other windows', colour: LIVE_NEUTRAL }] });
  });
});
