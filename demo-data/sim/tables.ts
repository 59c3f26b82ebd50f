import { featurizeImuRecording, FEATURE_NAMES } from '../../src/core/features';
import { seededRandom } from '../../src/core/random';
import { ACTIVITIES } from './activities';
import { formatFeature } from './format';
import { shuffle } from './noise';
import { SAMPLE_RATE_HZ, type SimulatedRecording } from './simulate';

export const WINDOW_SECONDS = 5;
/** Share of windows whose true activity is shown in activity_label (the rest stay blank). */
export const LABELLED_SHARE = 0.04;
export const META_COLUMNS = ['window_id', 'subject', 'session', 'start', 'end', 'device', 'placement', 'activity_label'];

/** One featurized window with its truth, before labels are blanked. */
export interface WindowRow {
  id: string;
  subject: string;
  start: number;
  end: number;
  activity: string;
  loose: boolean;
  features: Float64Array;
}

/** Featurize a simulated recording with the core featurizer, as a user's raw data would be. */
export function windowsOf(rec: SimulatedRecording): WindowRow[] {
  const fs = SAMPLE_RATE_HZ;
  const { starts, windowSamples, features } = featurizeImuRecording(
    { channels: rec.channels, sampleRateHz: fs, segments: rec.segments, fileName: `${rec.volunteer.id} (simulated)` },
    { windowSeconds: WINDOW_SECONDS },
  );
  const rows: WindowRow[] = [];
  const counts = new Int32Array(ACTIVITIES.length);
  let seg = 0;
  for (let w = 0; w < starts.length; w++) {
    const s = starts[w];
    while (s >= rec.segments[seg].end) seg++;
    const start = rec.segmentEpochs[seg] + (s - rec.segments[seg].start) / fs;
    counts.fill(0);
    for (let i = s; i < s + windowSamples; i++) counts[rec.activity[i]]++;
    let best = 0;
    for (let a = 1; a < counts.length; a++) if (counts[a] > counts[best]) best = a;
    rows.push({
      id: `${rec.volunteer.id}-${String(w + 1).padStart(4, '0')}`,
      subject: rec.volunteer.id,
      start,
      end: start + WINDOW_SECONDS,
      activity: ACTIVITIES[best],
      loose: rec.volunteer.loose,
      features: features.data.slice(w * features.d, (w + 1) * features.d),
    });
  }
  return rows;
}

/** Indices of the windows whose label is kept: a seeded LABELLED_SHARE of all windows. */
export function labelledWindows(count: number, seed: number): Set<number> {
  const order = shuffle(Array.from({ length: count }, (_, i) => i), seededRandom(seed));
  return new Set(order.slice(0, Math.round(count * LABELLED_SHARE)));
}

export function windowsCsv(rows: readonly WindowRow[], labelled: Set<number>): string {
  const lines = [[...META_COLUMNS, ...FEATURE_NAMES].join(',')];
  rows.forEach((r, i) => {
    const meta = [r.id, r.subject, 'morning', String(r.start), String(r.end), 'wrist-imu', 'left wrist', labelled.has(i) ? r.activity : ''];
    lines.push([...meta, ...Array.from(r.features, formatFeature)].join(','));
  });
  return `${lines.join('\n')}\n`;
}

export function truthCsv(rows: readonly WindowRow[]): string {
  const lines = ['window_id,activity,loose_watch'];
  for (const r of rows) lines.push(`${r.id},${r.activity},${r.loose ? 1 : 0}`);
  return `${lines.join('\n')}\n`;
}

/** The raw signal of one volunteer: worn samples only, so non-wear gaps show as jumps in time_s. */
export function rawCsv(rec: SimulatedRecording): string {
  const fs = SAMPLE_RATE_HZ;
  const c = rec.channels;
  const lines = ['time_s,acc_x,acc_y,acc_z,gyr_x,gyr_y,gyr_z'];
  rec.segments.forEach((seg, k) => {
    for (let i = seg.start; i < seg.end; i++) {
      const t = rec.segmentEpochs[k] + (i - seg.start) / fs;
      lines.push(
        `${t.toFixed(2)},${c.accX[i].toFixed(4)},${c.accY[i].toFixed(4)},${c.accZ[i].toFixed(4)},` +
          `${c.gyrX[i].toFixed(2)},${c.gyrY[i].toFixed(2)},${c.gyrZ[i].toFixed(2)}`,
      );
    }
  });
  return `${lines.join('\n')}\n`;
}
