import { normal, type Random } from '../../src/core/random';
import { ACTIVITIES, type Activity, type Style } from './activities';
import { shuffle, uniform } from './noise';

/** One invented volunteer of the "Home routines" demo and how their watch sits. */
export interface Volunteer {
  id: string;
  /** Worn loosely: wobble, high-frequency jitter and orientation slop (the planted trap). */
  loose: boolean;
  accGain: number;
  gyrGain: number;
  /** Fixed rotation of the watch on this wrist, row-major 3 × 3. */
  mount: Float64Array;
  gyrBias: [number, number, number];
  style: Style;
  /** Unix seconds at which the scripted morning starts. */
  startEpoch: number;
}

/** A bout of one activity, or a non-wear gap (activity null): the watch is off, nothing is recorded. */
export interface Bout {
  activity: Activity | null;
  seconds: number;
}

export const VOLUNTEER_COUNT = 12;
export const LOOSE_WATCH = new Set(['S04', 'S09']);
/** 2026-03-02 07:00 UTC: the invented date of every session. */
export const SESSION_DATE_EPOCH = Date.UTC(2026, 2, 2, 7, 0, 0) / 1000;

/** Rotation by `angle` (radians) about a unit axis (Rodrigues' formula), row-major. */
export function axisAngle(axis: [number, number, number], angle: number): Float64Array {
  const [x, y, z] = axis;
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const t = 1 - c;
  return Float64Array.of(
    t * x * x + c, t * x * y - s * z, t * x * z + s * y,
    t * x * y + s * z, t * y * y + c, t * y * z - s * x,
    t * x * z - s * y, t * y * z + s * x, t * z * z + c,
  );
}

function randomAxis(random: Random): [number, number, number] {
  const v: [number, number, number] = [normal(random), normal(random), normal(random)];
  const len = Math.hypot(...v) || 1;
  return [v[0] / len, v[1] / len, v[2] / len];
}

export function makeVolunteer(index: number, random: Random): Volunteer {
  const id = `S${String(index + 1).padStart(2, '0')}`;
  return {
    id,
    loose: LOOSE_WATCH.has(id),
    accGain: 1 + 0.03 * normal(random),
    gyrGain: 1 + 0.05 * normal(random),
    mount: axisAngle(randomAxis(random), (8 * Math.PI) / 180 * normal(random)),
    gyrBias: [0.5 * normal(random), 0.5 * normal(random), 0.5 * normal(random)],
    style: { tempo: 1 + 0.05 * normal(random), vigor: 1 + 0.12 * normal(random) },
    startEpoch: SESSION_DATE_EPOCH + 60 * Math.floor(uniform(random, 0, 90)),
  };
}

/**
 * The scripted morning: every activity twice in a shuffled order, bouts of 1–4 minutes, and after
 * about a quarter of the bouts (at least once) a non-wear gap of 1–10 minutes.
 */
export function makeSchedule(random: Random): Bout[] {
  const order = shuffle([...ACTIVITIES, ...ACTIVITIES], random);
  const bouts: Bout[] = [];
  let gaps = 0;
  order.forEach((activity, i) => {
    bouts.push({ activity, seconds: Math.round(uniform(random, 60, 240)) });
    const last = i === order.length - 1;
    if (!last && (random() < 0.25 || (gaps === 0 && i === order.length - 2))) {
      bouts.push({ activity: null, seconds: Math.round(uniform(random, 60, 600)) });
      gaps++;
    }
  });
  return bouts;
}
