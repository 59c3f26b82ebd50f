import { describe, expect, it } from 'vitest';
import { numericTimeUnit, parseIsoSeconds } from '../../../src/core/table/timestamps';
import { duckdb } from '../../fixtures/duckdb';

describe('parseIsoSeconds(text)', () => {
  it('agrees with DuckDB epoch() on ISO 8601 times with and without a zone (@duckdb/node-api 1.5)', async () => {
    const texts = ['1970-01-01T00:00:00Z', '2024-03-10T08:30:00Z', '2024-03-10 08:30:00', '2024-03-10T08:30:00.250Z',
      '2024-03-10T08:30:00+02:00', '2024-03-10T08:30:00-0530', '2023-12-31T23:59:59.999+00:00', '2024-02-29T12:00:00Z'];
    // DuckDB reads a TIMESTAMPTZ without a zone in its session zone: pin it to UTC, as we read such text.
    const rows = await duckdb("SET TimeZone = 'UTC'", `SELECT ${texts.map((t) => `epoch(TIMESTAMPTZ '${t}')`).join(', ')}`);
    const expected = rows[0].map(Number);
    texts.forEach((t, i) => expect(parseIsoSeconds(t)).toBeCloseTo(expected[i], 6));
  });

  it('reads a date alone as midnight UTC; 2000-01-01 is 946684800 s (from memory; = Date.UTC(2000, 0, 1) / 1000)', () => {
    expect(parseIsoSeconds('2000-01-01')).toBe(946684800);
    expect(parseIsoSeconds('2000-01-01')).toBe(Date.UTC(2000, 0, 1) / 1000);
  });

  it('refuses text that is not a valid ISO 8601 date or time', () => {
    for (const t of ['2024-13-01', '2024-02-30', '2023-02-29', '10/03/2024', '2024-03-10T25:00', 'walk', '1710059400', '2024-03-10T08:30:00 Z']) {
      expect(parseIsoSeconds(t)).toBeNaN();
    }
  });
});

describe('numericTimeUnit(values)', () => {
  it('tells epoch milliseconds from seconds by magnitude (common practice)', () => {
    expect(numericTimeUnit(Float64Array.from([1710059400000, 1710059405000]))).toBe('milliseconds');
    expect(numericTimeUnit(Float64Array.from([1710059400, 1710059405]))).toBe('seconds');
    expect(numericTimeUnit(Float64Array.from([0, 5, 10, NaN]))).toBe('seconds');
  });
});
