import { describe, expect, it } from 'vitest';
import { formatDuration, grouped, progressText } from '../../../src/core/progress/format';

describe('progress words', () => {
  it('groups thousands the same on every machine', () => {
    expect(grouped(0)).toBe('0');
    expect(grouped(999)).toBe('999');
    expect(grouped(1000)).toBe('1,000');
    expect(grouped(950_000)).toBe('950,000');
    expect(grouped(12_345_678)).toBe('12,345,678');
  });

  it('says durations in seconds, then minutes and seconds', () => {
    expect(formatDuration(400)).toBe('0 s');
    expect(formatDuration(12_400)).toBe('12 s');
    expect(formatDuration(65_000)).toBe('1 min 05 s');
  });

  it('joins stage, detail, elapsed and the ETA only when there is one', () => {
    expect(progressText({ stage: 'placing', detail: '2,000 / 5,000 windows', elapsedMs: 12_000, etaMs: 30_000 })).toBe('placing · 2,000 / 5,000 windows · 12 s elapsed · about 30 s left');
    expect(progressText({ stage: 'quality', detail: '', elapsedMs: 3000, etaMs: null })).toBe('quality · 3 s elapsed');
  });
});
