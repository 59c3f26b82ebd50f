import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { bytesSource, countingSource } from '../../../src/core/raw/byte-source';
import { INDEX_STEP } from '../../../src/core/raw/csv/csv-index';
import { openRawCsv } from '../../../src/core/raw/csv/read';
import { parseIsoSeconds } from '../../../src/core/raw/csv/time-value';

const enc = (s: string) => new TextEncoder().encode(s);

/** 50 Hz rows from Unix second `t0`, with a 60 s gap after `gapAfter` rows. */
function rawCsvText(rows: number, t0: number, gapAfter = Infinity): string {
  const lines = ['time_s,acc_x [g],gyr_x (deg/s)'];
  for (let i = 0; i < rows; i++) {
    const t = t0 + i / 50 + (i >= gapAfter ? 60 : 0);
    lines.push(`${t.toFixed(2)},${(i / 1000).toFixed(4)},${i % 7 === 0 ? '' : (-i / 100).toFixed(2)}`);
  }
  return `${lines.join('\n')}\n`;
}

async function failure(text: string): Promise<InputError> {
  try {
    await openRawCsv(bytesSource(enc(text)), 'raw.csv');
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('openRawCsv', () => {
  it('indexes Unix-second times: start, rate, units from the header, gaps as coverage', async () => {
    const csv = await openRawCsv(bytesSource(enc(rawCsvText(3000, 1772437080, 1000))), 'raw.csv');
    expect(csv.startEpoch).toBe(1772437080);
    expect(csv.index.rows).toBe(3000);
    expect(csv.index.rate).toBe(50);
    expect(csv.channels.map((c) => [c.label, c.unit])).toEqual([['acc_x [g]', 'g'], ['gyr_x (deg/s)', 'deg/s']]);
    expect(csv.coverage).toEqual([{ start: 0, end: 20 }, { start: 80, end: 120 }]);
  });

  it('reads a span from only the index blocks covering it, empty cells as NaN', async () => {
    const source = countingSource(bytesSource(enc(rawCsvText(20000, 1772437080))));
    const csv = await openRawCsv(source, 'raw.csv');
    source.reset();
    const span = await csv.readSpan(200, 201);
    expect(source.bytesRead).toBeLessThan(3 * INDEX_STEP * 30); // a couple of index blocks, not the ~600 kB file
    const [acc, gyr] = span.channels;
    expect(acc.t0).toBe(200);
    expect(acc.rate).toBe(50);
    expect(acc.samples.length).toBe(50);
    expect(acc.samples[0]).toBeCloseTo(10, 6); // row 10000: 10000 / 1000
    expect(gyr.samples[0]).toBeCloseTo(-100, 4);
    expect(gyr.samples[3]).toBeNaN(); // row 10003 = 7 × 1429: an empty cell
  });

  it('fills a gap inside the span with NaN', async () => {
    const csv = await openRawCsv(bytesSource(enc(rawCsvText(3000, 1772437080, 1000))), 'raw.csv');
    const acc = (await csv.readSpan(19.9, 80.1, ['acc_x [g]'])).channels[0];
    expect(acc.samples.length).toBe(Math.round((80.1 - 19.9) * 50));
    expect(acc.samples[0]).toBeCloseTo(0.995, 6);
    expect(acc.samples[100]).toBeNaN();
    expect(acc.samples[acc.samples.length - 1]).toBeCloseTo(1.004, 6);
  });

  it('reads ISO 8601 times with offsets, and relative seconds as they are', async () => {
    const iso = await openRawCsv(bytesSource(enc('timestamp,ppg\n2026-03-02T08:00:00+01:00,1\n2026-03-02T08:00:00.5+01:00,2\n2026-03-02T08:00:01+01:00,3\n')), 'iso.csv');
    expect(iso.startEpoch).toBe(parseIsoSeconds('2026-03-02T07:00:00Z'));
    expect(iso.index.rate).toBe(2);
    expect(Array.from((await iso.readSpan(0.5, 2)).channels[0].samples)).toEqual([2, 3]);
    const rel = await openRawCsv(bytesSource(enc('t,x\n0,1\n0.1,2\n0.2,3\n')), 'rel.csv');
    expect(rel.startEpoch).toBeNull();
    expect(rel.coverage[0].start).toBe(0);
  });

  it('names file, row and column for bad times and for times going backwards', async () => {
    expect((await failure('time,x\n0,1\nnoon,2\n')).message).toBe('raw.csv, row 3, column "time": expected a time in seconds like the rows above, found "noon"');
    expect((await failure('time,x\n0,1\n0.2,2\n0.1,3\n')).message).toMatch(/row 4, column "time": expected times increasing/);
    expect((await failure('time,x\n')).message).toMatch(/at least one data row/);
  });
});

describe('parseIsoSeconds', () => {
  it('reads UTC, offsets and fractions (ISO 8601; 1e9 s = 2001-09-09T01:46:40Z, common practice)', () => {
    expect(parseIsoSeconds('2001-09-09T01:46:40Z')).toBe(1e9);
    expect(parseIsoSeconds('2001-09-09T03:46:40.5+02:00')).toBe(1e9 + 0.5);
    expect(parseIsoSeconds('2001-02-30T00:00:00Z')).toBeNaN();
  });
});
