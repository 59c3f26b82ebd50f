import { describe, expect, it } from 'vitest';
import { bandPower, createSpectrum, dominantFrequency } from '../../../src/core/features/spectrum';
import { sdPopulation } from '../../../src/core/features/stats';
import { normal, seededRandom } from '../../../src/core/random';

const FS = 50;

function sine(n: number, hz: number, amplitude: number, offset = 0, phase = 0.3): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => offset + amplitude * Math.sin((2 * Math.PI * hz * i) / FS + phase));
}

describe('createSpectrum', () => {
  it('finds the frequency of a sine at a bin frequency (2 Hz in a 5 s window at 50 Hz)', () => {
    const s = createSpectrum(250, FS);
    s.compute(sine(250, 2, 0.3, 1));
    const dom = dominantFrequency(s, 0.3);
    expect(dom.hz).toBe(2);
    // A pure sine puts all its power in one bin.
    expect(dom.share).toBeCloseTo(1, 10);
  });

  it('puts A²/2 of a sine of amplitude A in the band that holds its frequency', () => {
    // Mean power of A·sin(ωt) over whole periods is A²/2 (textbook); 4.4 Hz lies in 3–6 Hz.
    const s = createSpectrum(250, FS);
    s.compute(sine(250, 4.4, 0.5, 0.2));
    expect(bandPower(s, 3, 6)).toBeCloseTo(0.125, 10);
    expect(bandPower(s, 0.3, 3)).toBeCloseTo(0, 10);
  });

  it.each([250, 125, 64])('satisfies Parseval: bins sum to the population variance (N = %i)', (n) => {
    // Parseval's theorem for the DFT: Σ|x|² = (1/N) Σ|X_k|²; with the mean removed the one-sided
    // periodogram sums to the variance (ddof 0).
    const random = seededRandom(42);
    const x = Float64Array.from({ length: n }, () => 0.7 + normal(random));
    const s = createSpectrum(n, FS);
    const p = s.compute(x);
    const total = p.reduce((a, b) => a + b, 0);
    expect(total).toBeCloseTo(sdPopulation(x) ** 2, 10);
    expect(bandPower(s, 0, Infinity)).toBeCloseTo(total, 12);
  });

  it('reads a window at an offset into a longer signal', () => {
    const long = Float64Array.of(...new Float64Array(40), ...sine(250, 6, 1));
    const s = createSpectrum(250, FS);
    s.compute(long, 40);
    expect(dominantFrequency(s, 0.3).hz).toBe(6);
  });

  it('gives 0 Hz and no power for a constant signal', () => {
    const s = createSpectrum(250, FS);
    s.compute(new Float64Array(250).fill(0.98));
    expect(dominantFrequency(s, 0.3)).toEqual({ hz: 0, share: 0 });
    expect(bandPower(s, 0, Infinity)).toBe(0);
  });
});
