import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { bytesSource, countingSource } from '../../../src/core/raw/byte-source';
import { openEdf } from '../../../src/core/raw/edf/read';
import { writeEdf, type EdfWriteInput } from '../../../src/core/raw/edf/write';
import { sineEdf } from './make-edf';

const START = { year: 2026, month: 3, day: 2, hour: 7, minute: 30, second: 5 };
const ascii = (b: Uint8Array, from: number, n: number) => String.fromCharCode(...b.subarray(from, from + n));

function twoRates(extra: Partial<EdfWriteInput> = {}): EdfWriteInput {
  return {
    patient: 'P01 F 01-JAN-1990 Test', recording: 'lab', start: START, recordDuration: 2, plus: true,
    signals: [
      { label: 'acc', unit: 'g', physMin: -8, physMax: 8, digMin: -2048, digMax: 2047, samplesPerRecord: 100, samples: Float64Array.from({ length: 300 }, (_, i) => Math.sin(i / 7) * 2) },
      { label: 'temp', transducer: 'thermistor', unit: 'degC', physMin: 20, physMax: 45, digMin: 0, digMax: 1000, prefilter: 'LP:1Hz', samplesPerRecord: 2, samples: Float64Array.from([30, 30.5, 31, 31.5, 32, 32.5]) },
    ],
    annotations: [{ onset: 0.5, duration: 1.25, text: 'walking' }, { onset: 4.2, text: 'Ende – fin' }],
    ...extra,
  };
}

async function failure(bytes: Uint8Array): Promise<InputError> {
  try {
    await openEdf(bytesSource(bytes), 'bad.edf');
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('writeEdf then openEdf', () => {
  it('writes the EDF+ header layout (header bytes = 256 + 256 × ns; EDF+ spec section 2.1)', () => {
    const b = writeEdf(twoRates());
    expect(ascii(b, 0, 8)).toBe('0       ');
    expect(ascii(b, 168, 16)).toBe('02.03.2607.30.05');
    expect(ascii(b, 184, 8).trim()).toBe(String(256 + 3 * 256));
    expect(ascii(b, 192, 5)).toBe('EDF+C');
    expect(ascii(b, 88, 22)).toBe('Startdate 02-MAR-2026 ');
  });

  it('round-trips two sampling rates, scaling, and annotations with UTF-8 text', async () => {
    const input = twoRates();
    const edf = await openEdf(bytesSource(writeEdf(input)), 'rt.edf');
    expect(edf.header.format).toBe('EDF+C');
    expect(edf.header.records).toBe(3);
    expect(edf.channels.map((c) => [c.label, c.unit, c.rate])).toEqual([['acc', 'g', 50], ['temp', 'degC', 1]]);
    const span = await edf.readSpan(0, 6);
    const [acc, temp] = span.channels;
    expect(acc.samples.length).toBe(300);
    const step = 16 / 4095; // one digital step of acc
    acc.samples.forEach((v, i) => expect(Math.abs(v - input.signals[0].samples[i])).toBeLessThanOrEqual(step / 2 + 1e-6));
    expect(Array.from(temp.samples)).toEqual(Array.from(input.signals[1].samples, (v) => Math.fround(v)));
    expect(await edf.annotations()).toEqual([{ onset: 0.5, duration: 1.25, text: 'walking' }, { onset: 4.2, text: 'Ende – fin' }]);
    expect(edf.header.signals[1]).toMatchObject({ transducer: 'thermistor', prefilter: 'LP:1Hz', physMin: 20, physMax: 45, digMin: 0, digMax: 1000 });
  });

  it('writes record onsets with gaps as EDF+D and reads them back from the time-keeping TALs', async () => {
    const edf = await openEdf(bytesSource(writeEdf(twoRates({ recordOnsets: [0, 2, 10] }))), 'd.edf');
    expect(edf.header.format).toBe('EDF+D');
    expect(Array.from(edf.recordOnsets)).toEqual([0, 2, 10]);
    expect(edf.coverage).toEqual([{ start: 0, end: 4 }, { start: 10, end: 12 }]);
    const temp = (await edf.readSpan(3, 11, ['temp'])).channels[0];
    // 1 Hz grid from t0 = 3: samples at 3 (record 2), 4..9 in the gap (NaN), 10 (record 3).
    expect(temp.t0).toBe(3);
    expect(Array.from(temp.samples)).toEqual([31.5, NaN, NaN, NaN, NaN, NaN, NaN, 32]);
  });

  it('keeps a sub-second start in the first time-keeping TAL', async () => {
    const edf = await openEdf(bytesSource(writeEdf(twoRates({ start: { ...START, subsecond: 0.25 } }))), 's.edf');
    expect(edf.recordOnsets[0]).toBe(0.25);
    expect(edf.coverage).toEqual([{ start: 0.25, end: 6.25 }]);
  });

  it('reads years 1985–2084 from two-digit dates (EDF spec: 85–99 -> 19xx, 00–84 -> 20xx)', async () => {
    for (const year of [1985, 1999, 2000, 2084]) {
      const plain = await openEdf(bytesSource(writeEdf({ ...twoRates(), plus: false, annotations: undefined, start: { ...START, year } })), 'y.edf');
      expect(plain.header.start.year).toBe(year);
    }
    expect(() => writeEdf({ ...twoRates(), start: { ...START, year: 2085 } })).toThrow(/1985 to 2084/);
  });

  it('reads a 10 s span from the middle of a 2 h, 6-channel, 50 Hz file from only the records covering it', async () => {
    const bytes = sineEdf(7200, 6, 50);
    const source = countingSource(bytesSource(bytes));
    const edf = await openEdf(source, 'long.edf');
    const headerBytes = 256 + 6 * 256;
    expect(source.bytesRead).toBe(256 + headerBytes); // the fixed part, then the whole header
    source.reset();
    const span = await edf.readSpan(3600.5, 3610.5);
    const recordBytes = 6 * 50 * 2;
    // [3600.5, 3610.5) touches records 3600..3610: 11 records, one read.
    expect(source.bytesRead).toBe(11 * recordBytes);
    expect(source.reads).toBe(1);
    expect(span.channels).toHaveLength(6);
    const c2 = span.channels[2];
    expect(c2.t0).toBe(3600.5);
    expect(c2.samples.length).toBe(500);
    // ch2 is sin(2π·3·t): at t = 3600.5 + 0.1 s the phase is 3·0.6 turns.
    expect(c2.samples[5]).toBeCloseTo(Math.sin(2 * Math.PI * 3 * 0.6), 3);
  });
});

describe('openEdf rejects broken files with a clear message', () => {
  const good = () => writeEdf(twoRates());

  it('a truncated file', async () => {
    const e = await failure(good().subarray(0, 1200));
    expect(e.message).toMatch(/bad\.edf: expected .*truncated.*found "1200 bytes"/);
  });

  it('a header byte count that disagrees with the number of signals', async () => {
    const b = good();
    b.set(new TextEncoder().encode('512     '), 184);
    expect((await failure(b)).message).toMatch(/header bytes.*256 \+ 256 × 3 signals = 1024/);
  });

  it('non-ASCII header text, naming the field and byte', async () => {
    const b = good();
    b[8 + 3] = 0xe9;
    const e = await failure(b);
    expect(e.details.column).toBe('header patient (byte 11)');
    expect(e.message).toMatch(/printable ASCII.*0xe9/);
  });

  it('a digital minimum not below the digital maximum', async () => {
    const b = good();
    const ns = 3;
    const digMinAt = 256 + ns * (16 + 80 + 8 + 8 + 8); // the first signal's digital minimum
    b.set(new TextEncoder().encode('2047    '), digMinAt);
    const e = await failure(b);
    expect(e.details.column).toBe('signal 1 digital minimum');
    expect(e.message).toMatch(/below the digital maximum \(2047\)/);
  });

  it('a file that is not EDF', async () => {
    expect((await failure(new TextEncoder().encode(`time,x\n${'1,2\n'.repeat(100)}`))).message).toMatch(/version field "0"/);
  });
});
