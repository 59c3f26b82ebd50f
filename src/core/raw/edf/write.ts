import { OptionError } from '../../errors';
import type { CivilTime } from '../civil-time';
import { daysInMonth } from '../civil-time';
import { encodeTal } from './tal';

/** One ordinary signal to write; `samples` are physical values, samplesPerRecord per data record. */
export interface EdfSignalInput {
  label: string;
  transducer?: string;
  unit: string;
  physMin: number;
  physMax: number;
  digMin: number;
  digMax: number;
  prefilter?: string;
  samplesPerRecord: number;
  samples: Float32Array | Float64Array;
}

export interface EdfAnnotationInput {
  /** Seconds after the header's start date and time. */
  onset: number;
  duration?: number;
  /** UTF-8 text without bytes 0x00, 0x14, 0x15. */
  text: string;
}

export interface EdfWriteInput {
  /** Patient field; for EDF+ "code sex birthdate name" (missing subfields written as X). */
  patient: string;
  /** Recording field; for EDF+ "Startdate dd-MMM-yyyy admin technician equipment" is put in front when absent. */
  recording: string;
  /** Start date and time; the year must be 1985–2084; a subsecond needs EDF+. */
  start: CivilTime;
  /** Seconds per data record (> 0 when there are signals). */
  recordDuration: number;
  signals: EdfSignalInput[];
  /** Written as TALs of the "EDF Annotations" signal (EDF+ only). */
  annotations?: EdfAnnotationInput[];
  /** Start of each data record, seconds after the start (EDF+ only): gaps make the file EDF+D. */
  recordOnsets?: ArrayLike<number>;
  /** EDF+ (with an annotation signal) rather than plain EDF. */
  plus: boolean;
}

const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];

/**
 * Writes an EDF (Kemp et al. 1992) or EDF+ (Kemp & Olivan 2003) file. Physical values are mapped to
 * 16-bit digital values by the header's linear scaling, rounded and clipped to [digMin, digMax].
 */
export function writeEdf(input: EdfWriteInput): Uint8Array {
  const { start, recordDuration: dur, signals, plus } = input;
  validate(input);
  const records = signals.length > 0 ? signals[0].samples.length / signals[0].samplesPerRecord : (input.recordOnsets?.length ?? 1);
  const sub = start.subsecond ?? 0;
  const onsets = Float64Array.from({ length: records }, (_, r) => (input.recordOnsets ? input.recordOnsets[r] : r * dur) + sub);
  const gapped = onsets.some((o, r) => Math.abs(o - (sub + r * dur)) > 1e-9);

  // Annotation bytes per record: the time-keeping TAL, then each annotation in the record that holds its onset.
  let tals: Uint8Array[][] = [];
  let talSamples = 0;
  if (plus) {
    tals = Array.from({ length: records }, (_, r) => [encodeTal(onsets[r], undefined, [''])]);
    for (const a of input.annotations ?? []) {
      let r = 0;
      while (r + 1 < records && onsets[r + 1] <= a.onset) r++;
      tals[r].push(encodeTal(a.onset, a.duration, [a.text]));
    }
    const most = Math.max(...tals.map((t) => t.reduce((s, b) => s + b.length, 0)));
    talSamples = Math.max(8, Math.ceil(most / 2));
  }

  const ns = signals.length + (plus ? 1 : 0);
  const headerBytes = 256 + 256 * ns;
  const spr = [...signals.map((s) => s.samplesPerRecord), ...(plus ? [talSamples] : [])];
  const recordBytes = 2 * spr.reduce((a, b) => a + b, 0);
  const out = new Uint8Array(headerBytes + records * recordBytes);

  const yy = String(start.year % 100).padStart(2, '0');
  const p2 = (n: number) => String(n).padStart(2, '0');
  let at = 0;
  const put = (text: string, width: number, name: string) => {
    if (text.length > width) throw new OptionError(name, text, `at most ${width} characters`);
    for (let i = 0; i < width; i++) out[at + i] = i < text.length ? text.charCodeAt(i) : 32;
    at += width;
  };
  put('0', 8, 'version');
  put(plus ? plusPatient(input.patient) : input.patient, 80, 'patient');
  put(plus ? plusRecording(input.recording, start) : input.recording, 80, 'recording');
  put(`${p2(start.day)}.${p2(start.month)}.${yy}`, 8, 'start date');
  put(`${p2(start.hour)}.${p2(start.minute)}.${p2(start.second)}`, 8, 'start time');
  put(String(headerBytes), 8, 'header bytes');
  put(plus ? (gapped ? 'EDF+D' : 'EDF+C') : '', 44, 'reserved');
  put(String(records), 8, 'data records');
  put(headerNumber(dur, 'recordDuration'), 8, 'record duration');
  put(String(ns), 4, 'signals');
  const all = [
    ...signals.map((s) => ({ ...s, transducer: s.transducer ?? '', prefilter: s.prefilter ?? '' })),
    ...(plus ? [{ label: 'EDF Annotations', transducer: '', unit: '', physMin: -1, physMax: 1, digMin: -32768, digMax: 32767, prefilter: '', samplesPerRecord: talSamples }] : []),
  ];
  const fields: [keyof (typeof all)[number], number][] = [
    ['label', 16], ['transducer', 80], ['unit', 8], ['physMin', 8], ['physMax', 8], ['digMin', 8], ['digMax', 8], ['prefilter', 80], ['samplesPerRecord', 8],
  ];
  for (const [name, width] of fields) {
    for (const s of all) {
      const v = s[name];
      put(typeof v === 'number' ? headerNumber(v, `${s.label} ${name}`) : String(v), width, `${s.label} ${name}`);
    }
  }
  for (let k = 0; k < ns; k++) put('', 32, 'signal reserved');

  const view = new DataView(out.buffer);
  for (let r = 0; r < records; r++) {
    let pos = headerBytes + r * recordBytes;
    for (const s of signals) {
      const gain = (s.physMax - s.physMin) / (s.digMax - s.digMin);
      const base = r * s.samplesPerRecord;
      for (let k = 0; k < s.samplesPerRecord; k++) {
        const d = Math.round((s.samples[base + k] - s.physMin) / gain + s.digMin);
        view.setInt16(pos, Number.isNaN(d) ? s.digMin : Math.min(s.digMax, Math.max(s.digMin, d)), true);
        pos += 2;
      }
    }
    if (plus) for (const t of tals[r]) {
      out.set(t, pos);
      pos += t.length;
    }
  }
  return out;
}

/** A number in at most 8 header characters, as exact as fits. */
function headerNumber(v: number, name: string): string {
  const plain = String(v);
  if (plain.length <= 8 && !plain.includes('e')) return plain;
  for (let digits = 8; digits >= 1; digits--) {
    const s = Number(v.toPrecision(digits)).toString();
    if (s.length <= 8 && !s.includes('e')) return s;
  }
  throw new OptionError(name, v, 'a number that fits in 8 characters');
}

function plusPatient(patient: string): string {
  return patient.trim().split(/ +/).length >= 4 ? patient : `X X X ${patient.trim().replace(/ +/g, '_') || 'X'}`;
}

function plusRecording(recording: string, s: CivilTime): string {
  if (recording.startsWith('Startdate ')) return recording;
  const date = `${String(s.day).padStart(2, '0')}-${MONTHS[s.month - 1]}-${s.year}`;
  return `Startdate ${date} X X X${recording ? ` ${recording}` : ''}`;
}

function validate(input: EdfWriteInput): void {
  const { start: s, signals, recordDuration: dur, plus } = input;
  const intIn = (v: number, lo: number, hi: number) => Number.isInteger(v) && v >= lo && v <= hi;
  if (!intIn(s.year, 1985, 2084)) throw new OptionError('start.year', s.year, 'a year from 1985 to 2084 (EDF dates)');
  if (!intIn(s.month, 1, 12) || !intIn(s.day, 1, daysInMonth(s.year, s.month))) throw new OptionError('start', s, 'a calendar date');
  if (!intIn(s.hour, 0, 23) || !intIn(s.minute, 0, 59) || !intIn(s.second, 0, 59)) throw new OptionError('start', s, 'a time of day');
  const sub = s.subsecond ?? 0;
  if (!(sub >= 0 && sub < 1)) throw new OptionError('start.subsecond', sub, 'a fraction in [0, 1)');
  if (sub !== 0 && !plus) throw new OptionError('start.subsecond', sub, '0 in plain EDF (a sub-second start needs EDF+)');
  if (!plus && (input.annotations?.length || input.recordOnsets)) throw new OptionError('plus', plus, 'true when annotations or record onsets are given');
  if (signals.length === 0 && !plus) throw new OptionError('signals', signals, 'at least one signal');
  if (signals.length > 0 && !(dur > 0)) throw new OptionError('recordDuration', dur, 'seconds > 0');
  for (const text of [input.patient, input.recording, ...signals.flatMap((x) => [x.label, x.transducer ?? '', x.unit, x.prefilter ?? ''])]) {
    if (!/^[\x20-\x7e]*$/.test(text)) throw new OptionError('header text', text, 'printable ASCII (EDF headers allow bytes 32–126 only)');
  }
  let records = -1;
  for (const x of signals) {
    if (x.label === 'EDF Annotations') throw new OptionError('signal label', x.label, 'a label other than "EDF Annotations" (added by the writer)');
    if (!intIn(x.digMin, -32768, 32767) || !intIn(x.digMax, -32768, 32767) || x.digMin >= x.digMax) {
      throw new OptionError(`${x.label} digMin/digMax`, [x.digMin, x.digMax], 'integers in -32768..32767 with digMin < digMax');
    }
    if (!(x.physMin !== x.physMax && Number.isFinite(x.physMin) && Number.isFinite(x.physMax))) throw new OptionError(`${x.label} physMin/physMax`, [x.physMin, x.physMax], 'two different finite numbers');
    if (!intIn(x.samplesPerRecord, 1, 99_999_999)) throw new OptionError(`${x.label} samplesPerRecord`, x.samplesPerRecord, 'an integer >= 1');
    const n = x.samples.length / x.samplesPerRecord;
    if (!Number.isInteger(n)) throw new OptionError(`${x.label} samples`, x.samples.length, `a multiple of samplesPerRecord (${x.samplesPerRecord})`);
    if (records >= 0 && n !== records) throw new OptionError(`${x.label} samples`, x.samples.length, `${records} records, as the other signals`);
    records = n;
  }
  const onsets = input.recordOnsets;
  if (onsets) {
    if (records >= 0 && onsets.length !== records) throw new OptionError('recordOnsets', onsets.length, `one onset per data record (${records})`);
    for (let r = 0; r < onsets.length; r++) {
      if (!Number.isFinite(onsets[r]) || onsets[r] < 0 || (r > 0 && onsets[r] < onsets[r - 1] + dur - 1e-9)) {
        throw new OptionError(`recordOnsets[${r}]`, onsets[r], 'increasing seconds >= 0, records not overlapping');
      }
    }
  }
  for (const a of input.annotations ?? []) {
    if (!Number.isFinite(a.onset) || (a.duration !== undefined && !(a.duration >= 0))) throw new OptionError('annotation', a, 'a finite onset and a duration >= 0');
  }
}
