import { describe, expect, it } from 'vitest';
import { cellTimeText, timeText } from '../../../src/core/table/time-text';

describe('timeText: one time format for window start and end', () => {
  it('writes absolute times as ISO 8601 in UTC, as ECMAScript Date#toISOString does (without zero milliseconds)', () => {
    // Reference: ECMA-262 Date.prototype.toISOString (the ISO 8601 extended format, UTC).
    for (const s of [1772440131, 978307200, 1700000000.25]) {
      const ref = new Date(s * 1000).toISOString().replace('.000Z', 'Z').replace(/(\.\d*?)0+Z$/, '$1Z');
      expect(timeText(s)).toBe(ref);
    }
    expect(timeText(1772440131)).toBe('2026-03-02T08:28:51Z');
  });

  it('writes times into a recording as seconds, and missing as missing', () => {
    expect(timeText(0)).toBe('0 s');
    expect(timeText(12.5)).toBe('12.5 s');
    expect(timeText(NaN)).toBe('(missing)');
  });

  it('reads milliseconds columns in seconds', () => {
    const ms = { kind: 'numeric' as const, name: 't', values: Float64Array.from([1772440131000, NaN]), time: 'milliseconds' as const };
    expect(cellTimeText(ms, 0)).toBe('2026-03-02T08:28:51Z');
    expect(cellTimeText(ms, 1)).toBe('(missing)');
  });
});
