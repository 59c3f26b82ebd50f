/**
 * Power spectrum of one window, for dominant frequency and band energies.
 *
 * Method: the mean is removed, then a direct real DFT (rectangular window, no zero padding) is
 * evaluated at the bins f_k = k · fs / N, k = 0..⌊N/2⌋, with a cosine table of length N. The
 * one-sided periodogram P_k = c_k · |X_k|² / N² (c_k = 2 except at k = 0 and, for even N, at the
 * Nyquist bin, where c_k = 1) sums, by Parseval's theorem, to the mean square of the mean-removed
 * signal, i.e. its population variance. A band energy is thus "the part of the variance in that
 * band", in squared signal units. A window whose deviations from its mean are below 1e-12 of the
 * mean is treated as flat (all power 0). Cost is O(N²/2) per window: for 5 s at 50 Hz (N = 250) that is
 * cheaper than padding to a power of two and exact at the natural 0.2 Hz bin spacing.
 */
export interface Spectrum {
  /** Samples per window. */
  readonly n: number;
  /** Frequency of each bin in Hz (length ⌊N/2⌋ + 1). */
  readonly freqs: Float64Array;
  /** One-sided power of each bin; overwritten by every `compute` call. */
  readonly power: Float64Array;
  /** Compute the power of x[start .. start + n) into `power` and return it. */
  compute(x: ArrayLike<number>, start?: number): Float64Array;
}

export function createSpectrum(n: number, sampleRateHz: number): Spectrum {
  const nBins = Math.floor(n / 2) + 1;
  const cosT = new Float64Array(n);
  const sinT = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    cosT[j] = Math.cos((2 * Math.PI * j) / n);
    sinT[j] = Math.sin((2 * Math.PI * j) / n);
  }
  const freqs = new Float64Array(nBins);
  for (let k = 0; k < nBins; k++) freqs[k] = (k * sampleRateHz) / n;
  const power = new Float64Array(nBins);
  const centred = new Float64Array(n);

  function compute(x: ArrayLike<number>, start = 0): Float64Array {
    let m = 0;
    for (let i = 0; i < n; i++) m += x[start + i];
    m /= n;
    let maxAbs = 0;
    for (let i = 0; i < n; i++) {
      centred[i] = x[start + i] - m;
      maxAbs = Math.max(maxAbs, Math.abs(centred[i]));
    }
    // A flat window leaves only rounding residue of the mean (~1e-16 relative): call it flat, so
    // that residue never shows up as a "dominant" frequency.
    if (maxAbs <= 1e-12 * Math.max(1, Math.abs(m))) {
      power.fill(0);
      return power;
    }
    const norm = 1 / (n * n);
    for (let k = 0; k < nBins; k++) {
      let re = 0;
      let im = 0;
      let idx = 0;
      for (let i = 0; i < n; i++) {
        re += centred[i] * cosT[idx];
        im -= centred[i] * sinT[idx];
        idx += k;
        if (idx >= n) idx -= n;
      }
      const both = k === 0 || (n % 2 === 0 && k === n / 2) ? 1 : 2;
      power[k] = both * (re * re + im * im) * norm;
    }
    return power;
  }

  return { n, freqs, power, compute };
}

/** Sum of power over bins with lowHz ≤ f < highHz. */
export function bandPower(spectrum: Spectrum, lowHz: number, highHz: number): number {
  const { freqs, power } = spectrum;
  let s = 0;
  for (let k = 0; k < freqs.length; k++) if (freqs[k] >= lowHz && freqs[k] < highHz) s += power[k];
  return s;
}

/**
 * Frequency (Hz) of the strongest bin at or above `minHz` (slow drifts below it are posture, not
 * rhythm), and that bin's share of the total power. A flat (constant) window gives 0 and 0; ties
 * go to the lower frequency.
 */
export function dominantFrequency(spectrum: Spectrum, minHz: number): { hz: number; share: number } {
  const { freqs, power } = spectrum;
  let best = -1;
  let bestPower = 0;
  let total = 0;
  for (let k = 0; k < freqs.length; k++) {
    total += power[k];
    if (freqs[k] >= minHz && power[k] > bestPower) {
      bestPower = power[k];
      best = k;
    }
  }
  if (Number.isNaN(total)) return { hz: NaN, share: NaN };
  if (best < 0 || total === 0) return { hz: 0, share: 0 };
  return { hz: freqs[best], share: bestPower / total };
}
