import { normal, type Random } from '../../src/core/random';

/**
 * Slowly wandering value: an Ornstein–Uhlenbeck process (stationary SD `sd`, time constant `tauS`)
 * smoothed by a 0.3 s low-pass, so that its rate of change (what a gyroscope sees) stays gentle.
 */
export function wander(n: number, fs: number, sd: number, tauS: number, random: Random): Float64Array {
  const out = new Float64Array(n);
  const a = Math.exp(-1 / (tauS * fs));
  const b = Math.sqrt(1 - a * a) * sd;
  const smooth = 1 - Math.exp(-1 / (0.3 * fs));
  let x = normal(random) * sd;
  let y = x;
  for (let i = -Math.round(fs); i < n; i++) {
    x = a * x + b * normal(random);
    y += (x - y) * smooth;
    if (i >= 0) out[i] = y;
  }
  return out;
}

/**
 * Narrow-band noise around `centerHz` with unit SD: white noise through a two-pole resonator
 * y[i] = 2 r cos(ω) y[i−1] − r² y[i−2] + e[i] (pole radius r sets the bandwidth), then rescaled.
 */
export function bandNoise(n: number, fs: number, centerHz: number, r: number, random: Random): Float64Array {
  const out = new Float64Array(n);
  const c1 = 2 * r * Math.cos((2 * Math.PI * centerHz) / fs);
  const c2 = -r * r;
  let y1 = 0;
  let y2 = 0;
  // Run in so the output starts in its steady state.
  for (let i = -200; i < n; i++) {
    const y = c1 * y1 + c2 * y2 + normal(random);
    y2 = y1;
    y1 = y;
    if (i >= 0) out[i] = y;
  }
  let ss = 0;
  for (let i = 0; i < n; i++) ss += out[i] * out[i];
  const scale = ss > 0 ? 1 / Math.sqrt(ss / n) : 0;
  for (let i = 0; i < n; i++) out[i] *= scale;
  return out;
}

/** A sinusoid whose frequency drifts by about ±`driftFraction` (phase accumulator), amplitude 1. */
export function driftingSine(n: number, fs: number, hz: number, driftFraction: number, random: Random): Float64Array {
  const drift = wander(n, fs, driftFraction, 4, random);
  const out = new Float64Array(n);
  let phase = random() * 2 * Math.PI;
  for (let i = 0; i < n; i++) {
    phase += (2 * Math.PI * hz * (1 + drift[i])) / fs;
    out[i] = Math.sin(phase);
  }
  return out;
}

/** Phase (radians) of a drifting rhythm, for signals built from harmonics of one beat. */
export function driftingPhase(n: number, fs: number, hz: number, driftFraction: number, random: Random): Float64Array {
  const drift = wander(n, fs, driftFraction, 4, random);
  const out = new Float64Array(n);
  let phase = random() * 2 * Math.PI;
  for (let i = 0; i < n; i++) {
    phase += (2 * Math.PI * hz * (1 + drift[i])) / fs;
    out[i] = phase;
  }
  return out;
}

export function uniform(random: Random, lo: number, hi: number): number {
  return lo + (hi - lo) * random();
}

/** Fisher–Yates shuffle in place with a seeded source. */
export function shuffle<T>(items: T[], random: Random): T[] {
  for (let i = items.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [items[i], items[j]] = [items[j], items[i]];
  }
  return items;
}
