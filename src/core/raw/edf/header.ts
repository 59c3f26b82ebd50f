import { InputError } from '../../errors';
import { daysInMonth } from '../civil-time';

/**
 * The EDF header (Kemp et al. 1992; EDF+ additions, Kemp & Olivan 2003): 256 fixed bytes, then
 * 256 bytes per signal, each field written for all signals in turn. All header text is ASCII 32..126.
 */
export interface EdfSignalHeader {
  index: number;
  label: string;
  transducer: string;
  unit: string;
  physMin: number;
  physMax: number;
  digMin: number;
  digMax: number;
  prefilter: string;
  samplesPerRecord: number;
  /** physical = gain * digital + offset. */
  gain: number;
  offset: number;
  /** True for an EDF+ "EDF Annotations" signal. */
  annotation: boolean;
  /** Byte offset of this signal's samples inside a data record. */
  recordOffset: number;
}

export interface EdfHeader {
  version: string;
  patient: string;
  recording: string;
  /** Start date and time as written (whole seconds; EDF+ sub-second starts live in the first TAL). */
  start: { year: number; month: number; day: number; hour: number; minute: number; second: number };
  headerBytes: number;
  reserved: string;
  /** 'EDF', 'EDF+C' (continuous) or 'EDF+D' (discontinuous). */
  format: 'EDF' | 'EDF+C' | 'EDF+D';
  /** Number of data records (counted from the file size when the header says -1). */
  records: number;
  recordDuration: number;
  signals: EdfSignalHeader[];
  /** Bytes of one data record. */
  recordBytes: number;
}

const FIXED = [
  ['version', 8], ['patient', 80], ['recording', 80], ['start date', 8], ['start time', 8],
  ['header bytes', 8], ['reserved', 44], ['data records', 8], ['record duration', 8], ['signals', 4],
] as const;
const PER_SIGNAL = [
  ['label', 16], ['transducer', 80], ['physical dimension', 8], ['physical minimum', 8], ['physical maximum', 8],
  ['digital minimum', 8], ['digital maximum', 8], ['prefiltering', 80], ['samples per record', 8], ['reserved', 32],
] as const;
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];

/** Reads the fixed part: how many header bytes to fetch for the whole header. */
export function edfHeaderLength(fixed: Uint8Array, fileName: string, fileSize: number): number {
  if (fixed.length < 256) truncated(fileName, `at least 256 header bytes`, fileSize);
  const version = String.fromCharCode(...fixed.subarray(0, 8));
  if (version !== '0       ') bad(fileName, 'header version', 'an EDF file: version field "0" padded with spaces', version);
  const fields = readFields(fixed, 0, FIXED, 1, fileName, () => 'header');
  const ns = intField(fields['signals'][0], fileName, 'number of signals', 0);
  const headerBytes = intField(fields['header bytes'][0], fileName, 'header bytes', 256);
  if (headerBytes !== 256 + 256 * ns) {
    bad(fileName, 'header bytes', `256 + 256 × ${ns} signals = ${256 + 256 * ns} header bytes`, String(headerBytes));
  }
  return headerBytes;
}

/** Parses the whole header (fixed part and signal blocks). */
export function parseEdfHeader(bytes: Uint8Array, fileName: string, fileSize: number): EdfHeader {
  const headerBytes = edfHeaderLength(bytes, fileName, fileSize);
  if (bytes.length < headerBytes || fileSize < headerBytes) truncated(fileName, `${headerBytes} header bytes`, fileSize);
  const f = readFields(bytes, 0, FIXED, 1, fileName, () => 'header');
  const ns = Number(f['signals'][0]);
  const s = readFields(bytes, 256, PER_SIGNAL, ns, fileName, (k) => `signal ${k + 1}`);
  const reserved = f['reserved'][0];
  const format = reserved.startsWith('EDF+D') ? 'EDF+D' : reserved.startsWith('EDF+C') ? 'EDF+C' : 'EDF';
  const recordDuration = numField(f['record duration'][0], fileName, 'record duration', 'seconds, a number >= 0');
  if (recordDuration < 0) bad(fileName, 'record duration', 'seconds, a number >= 0', f['record duration'][0]);

  const signals: EdfSignalHeader[] = [];
  let recordOffset = 0;
  for (let k = 0; k < ns; k++) {
    const col = (name: string) => `signal ${k + 1} ${name}`;
    const label = s['label'][k];
    const physMin = numField(s['physical minimum'][k], fileName, col('physical minimum'), 'a number');
    const physMax = numField(s['physical maximum'][k], fileName, col('physical maximum'), 'a number');
    const digMin = intField(s['digital minimum'][k], fileName, col('digital minimum'), -32768);
    const digMax = intField(s['digital maximum'][k], fileName, col('digital maximum'), -32768);
    if (digMax > 32767) bad(fileName, col('digital maximum'), 'an integer from -32768 to 32767', String(digMax));
    if (digMin >= digMax) bad(fileName, col('digital minimum'), `a digital minimum below the digital maximum (${digMax})`, String(digMin));
    if (physMin === physMax) bad(fileName, col('physical maximum'), `a physical maximum different from the physical minimum (${physMin})`, String(physMax));
    const samplesPerRecord = intField(s['samples per record'][k], fileName, col('samples per record'), 1);
    const gain = (physMax - physMin) / (digMax - digMin);
    signals.push({
      index: k, label, transducer: s['transducer'][k], unit: s['physical dimension'][k], physMin, physMax, digMin, digMax,
      prefilter: s['prefiltering'][k], samplesPerRecord, gain, offset: physMin - gain * digMin,
      annotation: format !== 'EDF' && label === 'EDF Annotations', recordOffset,
    });
    recordOffset += 2 * samplesPerRecord;
  }
  const recordBytes = recordOffset;
  const recordsText = f['data records'][0];
  let records = recordsText === '-1' ? -1 : intField(recordsText, fileName, 'data records', 0);
  const available = recordBytes > 0 ? Math.floor((fileSize - headerBytes) / recordBytes) : 0;
  if (records === -1) records = available;
  else if (available < records) {
    truncated(fileName, `${headerBytes} + ${records} records × ${recordBytes} bytes = ${headerBytes + records * recordBytes} bytes`, fileSize);
  }
  return {
    version: f['version'][0], patient: f['patient'][0], recording: f['recording'][0],
    start: parseStart(f['start date'][0], f['start time'][0], format !== 'EDF' ? f['recording'][0] : '', fileName),
    headerBytes, reserved, format, records, recordDuration, signals, recordBytes,
  };
}

/** dd.mm.yy and hh.mm.ss; yy 85–99 -> 19yy, 00–84 -> 20yy (EDF clipping years 1985–2084). EDF+ may give a 4-digit year in "Startdate dd-MMM-yyyy". */
function parseStart(date: string, time: string, recording: string, fileName: string): EdfHeader['start'] {
  const d = /^(\d\d)\.(\d\d)\.(\d\d)$/.exec(date);
  if (!d) bad(fileName, 'start date', 'a date dd.mm.yy', date);
  const t = /^(\d\d)\.(\d\d)\.(\d\d)$/.exec(time);
  if (!t) bad(fileName, 'start time', 'a time hh.mm.ss', time);
  const yy = Number(d[3]);
  let year = yy >= 85 ? 1900 + yy : 2000 + yy;
  const plus = /^Startdate (\d\d)-([A-Z]{3})-(\d{4})\b/.exec(recording);
  if (plus && MONTHS.includes(plus[2]) && Number(plus[3]) % 100 === yy) year = Number(plus[3]);
  const month = Number(d[2]);
  const day = Number(d[1]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) bad(fileName, 'start date', 'a real calendar date dd.mm.yy', date);
  const [hour, minute, second] = [Number(t[1]), Number(t[2]), Number(t[3])];
  if (hour > 23 || minute > 59 || second > 59) bad(fileName, 'start time', 'a time of day hh.mm.ss', time);
  return { year, month, day, hour, minute, second };
}

type Fields<N extends string> = Record<N, string[]>;

function readFields<N extends string>(
  bytes: Uint8Array, base: number, layout: readonly (readonly [N, number])[], count: number, fileName: string, owner: (k: number) => string,
): Fields<N> {
  const out = {} as Fields<N>;
  let at = base;
  for (const [name, width] of layout) {
    const values: string[] = [];
    for (let k = 0; k < count; k++) {
      let s = '';
      for (let i = at; i < at + width; i++) {
        const b = bytes[i];
        if (b < 32 || b > 126) {
          throw new InputError({
            file: fileName, column: `${owner(k)} ${name} (byte ${i})`,
            expected: 'header text in printable ASCII (bytes 32–126)', found: `byte 0x${b.toString(16).padStart(2, '0')}`,
          });
        }
        s += String.fromCharCode(b);
      }
      values.push(s.trimEnd());
      at += width;
    }
    out[name] = values;
  }
  return out;
}

function numField(text: string, fileName: string, column: string, expected: string): number {
  const t = text.trim();
  if (!NUMBER.test(t)) bad(fileName, column, expected, text);
  return Number(t);
}

function intField(text: string, fileName: string, column: string, min: number): number {
  const t = text.trim();
  const v = /^[+-]?\d+$/.test(t) ? Number(t) : NaN;
  if (!Number.isSafeInteger(v) || v < min) bad(fileName, column, `an integer >= ${min}`, text);
  return v;
}

function bad(file: string, column: string, expected: string, found: string): never {
  throw new InputError({ file, column, expected, found });
}

function truncated(file: string, expected: string, size: number): never {
  throw new InputError({ file, expected: `${expected} (the file is truncated)`, found: `${size} bytes` });
}
