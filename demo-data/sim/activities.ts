import type { Random } from '../../src/core/random';
import { bandNoise, driftingPhase, driftingSine, uniform, wander } from './noise';

/**
 * Invented wrist-motion models of the seven "Home routines" activities (demo data only). Device
 * frame: x along the forearm towards the hand, y across the wrist, z out of the watch face. Each
 * model gives a resting "up" direction (where gravity reads +1 g), rotation angles of the wrist over
 * time (radians, about x, y, z; the gyroscope sees their rate) and linear acceleration in g.
 */
export const ACTIVITIES = ['resting', 'walking', 'stairs', 'tooth-brushing', 'typing', 'eating', 'cycling'] as const;
export type Activity = (typeof ACTIVITIES)[number];

export interface Motion {
  up: [number, number, number];
  rx: Float64Array;
  ry: Float64Array;
  rz: Float64Array;
  lx: Float64Array;
  ly: Float64Array;
  lz: Float64Array;
}

/** How one volunteer moves: rhythm speed and movement size (both 1 on average). */
export interface Style {
  tempo: number;
  vigor: number;
}

const DEG = Math.PI / 180;

function blank(n: number, up: [number, number, number]): Motion {
  const z = () => new Float64Array(n);
  return { up, rx: z(), ry: z(), rz: z(), lx: z(), ly: z(), lz: z() };
}

function resting(n: number, fs: number, s: Style, rnd: Random): Motion {
  const m = blank(n, [-0.2, 0.85, 0.45]);
  const swayX = wander(n, fs, 1.2 * DEG, 6, rnd);
  const swayY = wander(n, fs, 1.2 * DEG, 6, rnd);
  const breath = driftingSine(n, fs, 0.25 * s.tempo, 0.05, rnd);
  for (let i = 0; i < n; i++) {
    m.rx[i] = swayX[i] + 0.4 * DEG * breath[i];
    m.ry[i] = swayY[i];
  }
  return m;
}

function gait(n: number, fs: number, s: Style, rnd: Random, stairs: boolean): Motion {
  const m = blank(n, stairs ? [-0.85, 0.3, 0.42] : [-0.95, 0.1, 0.3]);
  const stepHz = (stairs ? 1.5 : 1.9) * s.tempo * uniform(rnd, 0.96, 1.04);
  const phase = driftingPhase(n, fs, stepHz, 0.02, rnd);
  const swing = (stairs ? 8 : 18) * DEG * s.vigor;
  const bounce = (stairs ? 0.42 : 0.22) * s.vigor;
  const lean = wander(n, fs, 3 * DEG, 8, rnd);
  for (let i = 0; i < n; i++) {
    const p = phase[i];
    m.rz[i] = swing * Math.sin(p / 2);
    m.ry[i] = 3 * DEG * Math.sin(p) + lean[i];
    const v = stairs
      ? Math.sin(p) + 0.55 * Math.sin(2 * p + 0.4) + 0.3 * Math.sin(3 * p + 0.9)
      : Math.sin(p) + 0.35 * Math.sin(2 * p + 0.6);
    // Vertical bounce acts roughly along the hanging forearm (device x) and the face normal.
    m.lx[i] = -bounce * v * 0.9 + 0.08 * s.vigor * Math.sin(p / 2);
    m.lz[i] = bounce * v * 0.3;
    m.ly[i] = 0.05 * s.vigor * Math.sin(p / 2 + 1);
  }
  return m;
}

function toothBrushing(n: number, fs: number, s: Style, rnd: Random): Motion {
  const m = blank(n, [0.55, -0.35, 0.75]);
  const hz = 4.5 * s.tempo * uniform(rnd, 0.92, 1.08);
  const phase = driftingPhase(n, fs, hz, 0.04, rnd);
  const env = wander(n, fs, 0.25, 3, rnd);
  const drift = wander(n, fs, 6 * DEG, 5, rnd);
  for (let i = 0; i < n; i++) {
    const e = Math.max(0.15, Math.min(1.3, 0.85 + env[i]));
    const p = phase[i];
    m.ly[i] = 0.38 * s.vigor * e * Math.sin(p);
    m.lx[i] = 0.1 * s.vigor * e * Math.sin(p + 1);
    m.rx[i] = 4 * DEG * s.vigor * e * Math.sin(p + 0.5);
    m.ry[i] = drift[i];
  }
  return m;
}

function typing(n: number, fs: number, s: Style, rnd: Random): Motion {
  const m = blank(n, [0.05, 0.12, 0.99]);
  const hz = uniform(rnd, 7, 9);
  const tx = bandNoise(n, fs, hz, 0.96, rnd);
  const ty = bandNoise(n, fs, hz, 0.96, rnd);
  const tz = bandNoise(n, fs, hz, 0.96, rnd);
  const shift = wander(n, fs, 1.5 * DEG, 10, rnd);
  const amp = 0.03 * s.vigor;
  for (let i = 0; i < n; i++) {
    m.lx[i] = amp * tx[i];
    m.ly[i] = amp * ty[i];
    m.lz[i] = amp * tz[i];
    m.rx[i] = 0.2 * DEG * ty[i] + shift[i];
    m.ry[i] = 0.2 * DEG * tx[i];
  }
  // Keystrokes: short taps, about four a second.
  for (let i = 0; i < n; i++) {
    if (rnd() < (4 * s.tempo) / fs) {
      for (let j = 0; j < 3 && i + j < n; j++) m.lz[i + j] += 0.03 * (1 - j / 3);
    }
  }
  return m;
}

function eating(n: number, fs: number, s: Style, rnd: Random): Motion {
  const m = blank(n, [0.35, 0.1, 0.93]);
  const cutHz = uniform(rnd, 2, 3) * s.tempo;
  const cut = driftingSine(n, fs, cutHz, 0.05, rnd);
  const posture = wander(n, fs, 4 * DEG, 6, rnd);
  // Cutting happens in spells; lifts to the mouth every 8–18 s, each about 2.5 s.
  let cutting = rnd() < 0.5;
  let next = Math.round(uniform(rnd, 2, 8) * fs);
  let lift = Math.round(uniform(rnd, 1, 6) * fs);
  const lifts = new Float64Array(n);
  while (lift < n) {
    const len = Math.round(uniform(rnd, 2, 3.2) * fs);
    const height = uniform(rnd, 45, 65) * DEG;
    for (let j = 0; j < len && lift + j < n; j++) lifts[lift + j] = height * 0.5 * (1 - Math.cos((2 * Math.PI * j) / len));
    lift += len + Math.round((uniform(rnd, 8, 18) / s.tempo) * fs);
  }
  for (let i = 0; i < n; i++) {
    if (i >= next) {
      cutting = !cutting;
      next = i + Math.round(uniform(rnd, 2, 6) * fs);
    }
    const c = cutting && lifts[i] === 0 ? 1 : 0;
    m.ry[i] = -lifts[i] + posture[i];
    m.rx[i] = 3 * DEG * s.vigor * c * cut[i];
    m.lx[i] = 0.07 * s.vigor * c * cut[i];
    m.lz[i] = 0.02 * s.vigor * c * cut[i];
  }
  return m;
}

function cycling(n: number, fs: number, s: Style, rnd: Random): Motion {
  const m = blank(n, [0.25, -0.55, 0.8]);
  const cadence = 1.15 * s.tempo * uniform(rnd, 0.9, 1.1);
  const phase = driftingPhase(n, fs, cadence, 0.03, rnd);
  const grip = wander(n, fs, 2 * DEG, 10, rnd);
  for (let i = 0; i < n; i++) {
    const p = phase[i];
    m.rx[i] = 7 * DEG * s.vigor * Math.sin(p) + grip[i];
    m.ry[i] = 2 * DEG * Math.sin(2 * p + 0.3);
    m.lz[i] = 0.05 * s.vigor * Math.sin(p);
    m.ly[i] = 0.04 * s.vigor * Math.sin(2 * p + 0.7);
  }
  return m;
}

export function synthesize(activity: Activity, n: number, fs: number, style: Style, random: Random): Motion {
  switch (activity) {
    case 'resting':
      return resting(n, fs, style, random);
    case 'walking':
      return gait(n, fs, style, random, false);
    case 'stairs':
      return gait(n, fs, style, random, true);
    case 'tooth-brushing':
      return toothBrushing(n, fs, style, random);
    case 'typing':
      return typing(n, fs, style, random);
    case 'eating':
      return eating(n, fs, style, random);
    case 'cycling':
      return cycling(n, fs, style, random);
  }
}
