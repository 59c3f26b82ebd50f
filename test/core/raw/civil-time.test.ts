import { describe, expect, it } from 'vitest';
import { civilFromEpoch, epochFromCivil, isoFromEpoch } from '../../../src/core/raw/civil-time';

describe('civil time <-> Unix seconds', () => {
  it('matches known instants', () => {
    // Unix epoch and the 1,000,000,000-second mark, 2001-09-09 01:46:40 UTC (common practice).
    expect(epochFromCivil({ year: 1970, month: 1, day: 1, hour: 0, minute: 0, second: 0 })).toBe(0);
    expect(epochFromCivil({ year: 2001, month: 9, day: 9, hour: 1, minute: 46, second: 40 })).toBe(1e9);
    // 2000-02-29 exists (divisible by 400), 2100 is not a leap year: 2100-03-01 follows 2100-02-28.
    const feb28 = epochFromCivil({ year: 2100, month: 2, day: 28, hour: 0, minute: 0, second: 0 });
    expect(civilFromEpoch(feb28 + 86400)).toMatchObject({ year: 2100, month: 3, day: 1 });
    expect(civilFromEpoch(epochFromCivil({ year: 2000, month: 2, day: 29, hour: 23, minute: 59, second: 59 }))).toMatchObject({ year: 2000, month: 2, day: 29, hour: 23, minute: 59, second: 59 });
  });

  it('round-trips every day from 1985 to 2084 and prints ISO 8601', () => {
    const from = epochFromCivil({ year: 1985, month: 1, day: 1, hour: 0, minute: 0, second: 0 });
    const to = epochFromCivil({ year: 2085, month: 1, day: 1, hour: 0, minute: 0, second: 0 });
    const bad: number[] = [];
    for (let t = from; t < to; t += 86400 + 3661) if (epochFromCivil(civilFromEpoch(t)) !== t) bad.push(t);
    expect(bad).toEqual([]);
    expect(isoFromEpoch(1e9 + 0.25)).toBe('2001-09-09T01:46:40.25Z');
  });
});
