import { describe, expect, it } from 'vitest';
import { CATEGORY_COLOURS, contrastRatio, MISSING_COLOUR, textColourOn, VALUE_COLOURS } from '../../src/app/lib/palette';

describe('one meaning per colour', () => {
  it('gives column values and channels colours no cluster has', () => {
    const clusters = new Set(CATEGORY_COLOURS.map((c) => c.toLowerCase()));
    for (const v of VALUE_COLOURS) expect(clusters.has(v.toLowerCase()), v).toBe(false);
    expect(new Set(VALUE_COLOURS).size).toBe(VALUE_COLOURS.length);
    expect(VALUE_COLOURS).not.toContain(MISSING_COLOUR);
  });

  it('computes contrast as WCAG 2.x defines it', () => {
    // WCAG 2.x: black on white is 21:1; #767676 on white is the well-known 4.54:1 (common practice).
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#ffffff', '#ffffff')).toBe(1);
  });

  it('puts text on every cluster and value colour at WCAG AA contrast (4.5:1) or better', () => {
    for (const bg of [...CATEGORY_COLOURS, ...VALUE_COLOURS]) {
      expect(contrastRatio(textColourOn(bg), bg), bg).toBeGreaterThanOrEqual(4.5);
    }
    // White on Okabe–Ito yellow was the unreadable case: black is chosen there.
    expect(textColourOn('#F0E442')).toBe('#000000');
  });
});
