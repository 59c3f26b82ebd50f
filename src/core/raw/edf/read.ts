import { InputError } from '../../errors';
import type { ByteSource } from '../byte-source';
import { epochFromCivil } from '../civil-time';
import { gridLength, pickChannels } from '../pick-channels';
import type { ChannelSpan, Coverage, RawSource, RawSpan } from '../span.types';
import { edfHeaderLength, parseEdfHeader, type EdfHeader, type EdfSignalHeader } from './header';
import { parseTals, type EdfAnnotation } from './tal';

/** An EDF or EDF+ file opened for random access: only the header (and for EDF+D the time-keeping TALs) is read. */
export interface EdfFile extends RawSource {
  kind: 'edf';
  header: EdfHeader;
  /** Start of every data record, seconds after the header's start date and time. */
  recordOnsets: Float64Array;
  /** The ordinary (non-annotation) signals, in file order; `channels` lists the same. */
  dataSignals: EdfSignalHeader[];
  /** Every annotation of every annotation signal except the time-keeping ones, sorted by onset (reads all records once). */
  annotations(): Promise<EdfAnnotation[]>;
}

/** Records whose annotation bytes are fetched per batch of reads. */
const BATCH = 256;

export async function openEdf(source: ByteSource, fileName: string): Promise<EdfFile> {
  const fixed = await source.read(0, 256);
  const headerBytes = edfHeaderLength(fixed, fileName, source.size);
  const header = parseEdfHeader(await source.read(0, headerBytes), fileName, source.size);
  const dataSignals = header.signals.filter((s) => !s.annotation);
  const tals = header.signals.filter((s) => s.annotation);
  if (header.format !== 'EDF' && tals.length === 0) {
    throw new InputError({ file: fileName, expected: 'an "EDF Annotations" signal in an EDF+ file (it keeps the time of each record)' });
  }
  const { records, recordDuration: dur } = header;
  const onsets = new Float64Array(records);
  let annotationCache: EdfAnnotation[] | null = null;

  /** Reads the first annotation signal of records [from, to) and the TALs of every annotation signal. */
  const readTals = async (from: number, to: number, all: boolean) => {
    const found: EdfAnnotation[] = [];
    const keep = all ? tals : tals.slice(0, 1);
    for (let b = from; b < to; b += BATCH) {
      const jobs: Promise<void>[] = [];
      for (let r = b; r < Math.min(to, b + BATCH); r++) {
        for (const [j, sig] of keep.entries()) {
          const at = header.headerBytes + r * header.recordBytes + sig.recordOffset;
          jobs.push(source.read(at, 2 * sig.samplesPerRecord).then((bytes) => {
            const t = parseTals(bytes, { file: fileName, record: r }, j === 0);
            if (j === 0) {
              if (t.recordOnset === null) {
                throw new InputError({ file: fileName, column: `EDF Annotations, data record ${r + 1}`, expected: 'a time-keeping TAL such as "+12" 0x14 0x14 0x00 at the start of every record' });
              }
              onsets[r] = t.recordOnset;
            }
            found.push(...t.annotations);
          }));
        }
      }
      await Promise.all(jobs);
    }
    return found;
  };

  if (header.format === 'EDF') {
    for (let r = 0; r < records; r++) onsets[r] = r * dur;
  } else if (header.format === 'EDF+C') {
    if (records > 0) await readTals(0, 1, false);
    const first = records > 0 ? onsets[0] : 0;
    for (let r = 0; r < records; r++) onsets[r] = first + r * dur;
  } else {
    annotationCache = sortByOnset(await readTals(0, records, true));
    for (let r = 1; r < records; r++) {
      if (!(onsets[r] >= onsets[r - 1] + dur - 1e-6)) {
        throw new InputError({ file: fileName, column: `EDF Annotations, data record ${r + 1}`, expected: `a record onset at or after ${onsets[r - 1] + dur} s (records in time order, not overlapping)`, found: String(onsets[r]) });
      }
    }
  }

  const channels = dataSignals.map((s) => ({ label: s.label, unit: s.unit, rate: dur > 0 ? s.samplesPerRecord / dur : 0 }));
  const startEpoch = epochFromCivil(header.start);

  return {
    kind: 'edf', fileName, header, recordOnsets: onsets, dataSignals, channels, startEpoch,
    coverage: coverageOf(onsets, dur),
    async annotations() {
      annotationCache ??= sortByOnset(await readTals(0, records, true));
      return annotationCache;
    },
    async readSpan(start: number, end: number, chosen?: readonly (string | number)[]): Promise<RawSpan> {
      const picked = pickChannels(channels, chosen);
      // First record ending after `start`, last record starting before `end`.
      const r0 = firstIndex(onsets, (o) => o + dur > start);
      const r1 = firstIndex(onsets, (o) => o >= end) - 1;
      if (dur === 0 || r0 > r1 || end <= start) {
        return { channels: picked.map((i) => ({ ...channels[i], t0: start, samples: new Float32Array(0) })) };
      }
      const bytes = await source.read(header.headerBytes + r0 * header.recordBytes, (r1 - r0 + 1) * header.recordBytes);
      if (bytes.length < (r1 - r0 + 1) * header.recordBytes) {
        throw new InputError({ file: fileName, expected: `data records ${r0 + 1}–${r1 + 1} (the file is truncated)`, found: `${source.size} bytes` });
      }
      const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
      const out: ChannelSpan[] = picked.map((i) => {
        const sig = dataSignals[i];
        const rate = channels[i].rate;
        const k0 = Math.max(0, Math.ceil((start - onsets[r0]) * rate - 1e-6));
        const t0 = onsets[r0] + k0 / rate;
        const samples = new Float32Array(gridLength(t0, Math.min(end, onsets[r1] + dur), rate)).fill(NaN);
        for (let r = r0; r <= r1; r++) {
          const base = (r - r0) * header.recordBytes + sig.recordOffset;
          const shift = Math.round((onsets[r] - t0) * rate);
          for (let k = 0; k < sig.samplesPerRecord; k++) {
            const j = shift + k;
            if (j >= 0 && j < samples.length) samples[j] = sig.gain * view.getInt16(base + 2 * k, true) + sig.offset;
          }
        }
        return { label: sig.label, unit: sig.unit, rate, t0, samples };
      });
      return { channels: out };
    },
  };
}

function sortByOnset(a: EdfAnnotation[]): EdfAnnotation[] {
  return a.map((x, i) => [x, i] as const).sort((p, q) => p[0].onset - q[0].onset || p[1] - q[1]).map((p) => p[0]);
}

/** Smallest i with pred(a[i]) true, for a predicate monotone over the sorted array (a.length if none). */
function firstIndex(a: Float64Array, pred: (v: number) => boolean): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (pred(a[mid])) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

function coverageOf(onsets: Float64Array, dur: number): Coverage[] {
  const out: Coverage[] = [];
  for (const o of onsets) {
    const last = out[out.length - 1];
    if (last && Math.abs(last.end - o) < 1e-6) last.end = o + dur;
    else out.push({ start: o, end: o + dur });
  }
  return out;
}
