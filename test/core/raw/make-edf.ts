import { writeEdf, type EdfWriteInput } from '../../../src/core/raw/edf/write';

/** A plain-EDF recording of `channels` sines at `rate` Hz, `seconds` long, in 1 s records. */
export function sineEdf(seconds: number, channels: number, rate: number, extra: Partial<EdfWriteInput> = {}): Uint8Array {
  return writeEdf({
    patient: 'P01', recording: 'bench', start: { year: 2026, month: 3, day: 2, hour: 8, minute: 0, second: 0 }, recordDuration: 1, plus: false,
    signals: Array.from({ length: channels }, (_, c) => ({
      label: `ch${c}`, unit: 'g', physMin: -4, physMax: 4, digMin: -32768, digMax: 32767, samplesPerRecord: rate,
      samples: Float64Array.from({ length: seconds * rate }, (_, i) => Math.sin((2 * Math.PI * (c + 1) * i) / rate)),
    })),
    ...extra,
  });
}
