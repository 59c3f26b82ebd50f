import { describe, expect, it } from 'vitest';
import { InputError, OptionError } from '../../../src/core/errors';
import { contiguousSegments, windowStarts } from '../../../src/core/features/windowing';

describe('windowStarts', () => {
  it('cuts 5 s windows without overlap by default and drops a short remainder', () => {
    expect(Array.from(windowStarts(1010, 50))).toEqual([0, 250, 500, 750]);
  });

  it('steps by the hop when one is given', () => {
    expect(Array.from(windowStarts(500, 50, { windowSeconds: 5, hopSeconds: 2.5 }))).toEqual([0, 125, 250]);
  });

  it('never lets a window cross a gap between segments', () => {
    const starts = windowStarts(
      [
        { start: 0, end: 300 },
        { start: 300, end: 900 },
      ],
      50,
    );
    expect(Array.from(starts)).toEqual([0, 300, 550]);
  });

  it('rejects bad options with the option named', () => {
    expect(() => windowStarts(100, 0)).toThrow(OptionError);
    expect(() => windowStarts(100, 50, { windowSeconds: -1 })).toThrow(/windowSeconds/);
    expect(() => windowStarts(100, 50, { hopSeconds: 0 })).toThrow(/hopSeconds/);
  });
});

describe('contiguousSegments', () => {
  it('splits at gaps longer than 1.5 sample periods', () => {
    const t = [0, 0.02, 0.04, 10, 10.02, 10.04, 10.06];
    expect(contiguousSegments(t, 50)).toEqual([
      { start: 0, end: 3 },
      { start: 3, end: 7 },
    ]);
  });

  it('names file, row and column when time goes backwards', () => {
    try {
      contiguousSegments([0, 0.02, 0.01], 50, { fileName: 'S01.csv' });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      // Data row 3 is file row 4 (the header is row 1).
      expect((e as InputError).message).toBe('S01.csv, row 4, column "time_s": expected time stamps that increase from row to row, found "0.01"');
    }
  });
});
