import { civilFromEpoch } from '../../src/core/raw/civil-time';
import { writeEdf, type EdfAnnotationInput, type EdfSignalInput } from '../../src/core/raw/edf/write';
import { ACTIVITIES } from './activities';
import { ACC_STEP, GYR_STEP, SAMPLE_RATE_HZ, type SimulatedRecording } from './simulate';

/** Seconds per EDF data record; every worn stretch is a whole number of seconds long. */
const RECORD_SECONDS = 1;

/**
 * The raw signal of one volunteer as EDF+D: one data record per worn second (non-wear gaps are
 * missing records), the six IMU channels at the sensor resolution (one digital step = ACC_STEP g or
 * GYR_STEP deg/s, so the values equal the raw CSV's), and an annotation at each activity change.
 */
export function rawEdf(rec: SimulatedRecording): Uint8Array {
  const fs = SAMPLE_RATE_HZ;
  const spr = fs * RECORD_SECONDS;
  const t0 = rec.segmentEpochs[0];
  const onsets: number[] = [];
  const annotations: EdfAnnotationInput[] = [];
  rec.segments.forEach((seg, k) => {
    const from = rec.segmentEpochs[k] - t0;
    for (let i = seg.start; i < seg.end; i += spr) onsets.push(from + (i - seg.start) / fs);
    let run = seg.start;
    for (let i = seg.start + 1; i <= seg.end; i++) {
      if (i === seg.end || rec.activity[i] !== rec.activity[run]) {
        annotations.push({ onset: from + (run - seg.start) / fs, duration: (i - run) / fs, text: ACTIVITIES[rec.activity[run]] });
        run = i;
      }
    }
  });
  const c = rec.channels;
  const signal = (label: string, unit: string, step: number, samples: Float64Array): EdfSignalInput => ({
    label, transducer: 'wrist IMU (simulated)', unit, physMin: -32768 * step, physMax: 32767 * step,
    digMin: -32768, digMax: 32767, prefilter: 'none', samplesPerRecord: spr, samples,
  });
  const start = civilFromEpoch(t0);
  return writeEdf({
    patient: `${rec.volunteer.id} X X Invented_volunteer_${rec.volunteer.id}`,
    recording: 'X X Home_routines_demo_(invented_data)',
    start: { ...start, subsecond: 0 },
    recordDuration: RECORD_SECONDS,
    signals: [
      signal('acc_x', 'g', ACC_STEP, c.accX), signal('acc_y', 'g', ACC_STEP, c.accY), signal('acc_z', 'g', ACC_STEP, c.accZ),
      signal('gyr_x', 'deg/s', GYR_STEP, c.gyrX), signal('gyr_y', 'deg/s', GYR_STEP, c.gyrY), signal('gyr_z', 'deg/s', GYR_STEP, c.gyrZ),
    ],
    annotations,
    recordOnsets: onsets,
    plus: true,
  });
}
