import type { ImuChannels } from '../../src/core/features';
import type { Segment } from '../../src/core/features';
import { normal, type Random } from '../../src/core/random';
import { ACTIVITIES, synthesize, type Motion } from './activities';
import { bandNoise, wander } from './noise';
import { makeSchedule, type Volunteer } from './volunteers';

export const SAMPLE_RATE_HZ = 50;
const DEG = Math.PI / 180;
/** Sensor resolution: acceleration to 1e-4 g, rotation rate to 0.01 deg/s (what the raw CSV prints). */
export const ACC_STEP = 1e-4;
export const GYR_STEP = 1e-2;

/** The simulated raw recording of one volunteer: worn samples only, split at non-wear gaps. */
export interface SimulatedRecording {
  volunteer: Volunteer;
  channels: ImuChannels & { accX: Float64Array; accY: Float64Array; accZ: Float64Array; gyrX: Float64Array; gyrY: Float64Array; gyrZ: Float64Array };
  /** Index into ACTIVITIES of the true activity of every sample. */
  activity: Uint8Array;
  segments: Segment[];
  /** Unix seconds of the first sample of each segment. */
  segmentEpochs: number[];
}

export function simulateVolunteer(volunteer: Volunteer, random: Random): SimulatedRecording {
  const fs = SAMPLE_RATE_HZ;
  const schedule = makeSchedule(random);
  const total = schedule.reduce((s, b) => s + (b.activity ? b.seconds * fs : 0), 0);
  const ch = {
    accX: new Float64Array(total), accY: new Float64Array(total), accZ: new Float64Array(total),
    gyrX: new Float64Array(total), gyrY: new Float64Array(total), gyrZ: new Float64Array(total),
  };
  const activity = new Uint8Array(total);
  const segments: Segment[] = [];
  const segmentEpochs: number[] = [];
  let clock = volunteer.startEpoch;
  let at = 0;
  let segStart = -1;
  for (const bout of schedule) {
    if (bout.activity === null) {
      if (segStart >= 0) segments.push({ start: segStart, end: at });
      segStart = -1;
      clock += bout.seconds;
      continue;
    }
    if (segStart < 0) {
      segStart = at;
      segmentEpochs.push(clock);
    }
    const n = bout.seconds * fs;
    const motion = synthesize(bout.activity, n, fs, volunteer.style, random);
    render(motion, volunteer, random, ch, at);
    activity.fill(ACTIVITIES.indexOf(bout.activity), at, at + n);
    at += n;
    clock += bout.seconds;
  }
  if (segStart >= 0) segments.push({ start: segStart, end: at });
  return { volunteer, channels: ch, activity, segments, segmentEpochs };
}

type Channels = SimulatedRecording['channels'];

/** Turn a motion model into sensor readings on this volunteer's wrist, written at `offset`. */
function render(m: Motion, v: Volunteer, random: Random, ch: Channels, offset: number): void {
  const fs = SAMPLE_RATE_HZ;
  const n = m.rx.length;
  const upLen = Math.hypot(...m.up);
  const [ux, uy, uz] = m.up.map((c) => c / upLen);
  // Loose watch: the case slops around the wrist and rattles at its own high frequency.
  const slopX = v.loose ? wander(n, fs, 10 * DEG, 12, random) : null;
  const slopY = v.loose ? wander(n, fs, 10 * DEG, 12, random) : null;
  const rattle = v.loose ? [0, 1, 2].map(() => bandNoise(n, fs, 16, 0.85, random)) : null;
  const rx = new Float64Array(n);
  const ry = new Float64Array(n);
  const rz = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    rx[i] = m.rx[i] + (slopX ? slopX[i] : 0);
    ry[i] = m.ry[i] + (slopY ? slopY[i] : 0);
    rz[i] = m.rz[i];
  }
  const M = v.mount;
  for (let i = 0; i < n; i++) {
    // Gravity seen by the rotated wrist: Rz · Ry · Rx applied to the resting up direction.
    const cx = Math.cos(rx[i]), sx = Math.sin(rx[i]);
    const cy = Math.cos(ry[i]), sy = Math.sin(ry[i]);
    const cz = Math.cos(rz[i]), sz = Math.sin(rz[i]);
    const y1 = cx * uy - sx * uz;
    const z1 = sx * uy + cx * uz;
    const x2 = cy * ux + sy * z1;
    const z2 = -sy * ux + cy * z1;
    const x3 = cz * x2 - sz * y1;
    const y3 = sz * x2 + cz * y1;
    let ax = x3 + m.lx[i];
    let ay = y3 + m.ly[i];
    let az = z2 + m.lz[i];
    // Rotation rate from the angle series (central differences), in deg/s.
    const a = Math.max(0, i - 1);
    const b = Math.min(n - 1, i + 1);
    const k = fs / (b - a) / DEG;
    let gx = (rx[b] - rx[a]) * k;
    let gy = (ry[b] - ry[a]) * k;
    let gz = (rz[b] - rz[a]) * k;
    if (rattle) {
      const motion = Math.hypot(m.lx[i], m.ly[i], m.lz[i]);
      const amp = 0.09 + 0.1 * motion;
      ax += amp * rattle[0][i];
      ay += amp * rattle[1][i];
      az += amp * rattle[2][i];
      gx += (25 + 30 * motion) * rattle[1][i];
      gy += (25 + 30 * motion) * rattle[2][i];
      gz += (25 + 30 * motion) * rattle[0][i];
    }
    const o = offset + i;
    ch.accX[o] = quantize(v.accGain * (M[0] * ax + M[1] * ay + M[2] * az) + 0.004 * normal(random), ACC_STEP);
    ch.accY[o] = quantize(v.accGain * (M[3] * ax + M[4] * ay + M[5] * az) + 0.004 * normal(random), ACC_STEP);
    ch.accZ[o] = quantize(v.accGain * (M[6] * ax + M[7] * ay + M[8] * az) + 0.004 * normal(random), ACC_STEP);
    ch.gyrX[o] = quantize(v.gyrGain * (M[0] * gx + M[1] * gy + M[2] * gz) + v.gyrBias[0] + 0.35 * normal(random), GYR_STEP);
    ch.gyrY[o] = quantize(v.gyrGain * (M[3] * gx + M[4] * gy + M[5] * gz) + v.gyrBias[1] + 0.35 * normal(random), GYR_STEP);
    ch.gyrZ[o] = quantize(v.gyrGain * (M[6] * gx + M[7] * gy + M[8] * gz) + v.gyrBias[2] + 0.35 * normal(random), GYR_STEP);
  }
}

/** Round to the sensor step; the result equals parsing its fixed-point print (k / 10^d). */
function quantize(x: number, step: number): number {
  const inv = Math.round(1 / step);
  return Math.round(x * inv) / inv;
}
