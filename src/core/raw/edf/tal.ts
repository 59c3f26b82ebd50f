import { InputError } from '../../errors';

/**
 * Time-stamped Annotation Lists (TALs) of an EDF+ "EDF Annotations" signal (EDF+ specification,
 * Kemp & Olivan 2003, section 2.2.2):  +onset [0x15 duration] 0x14 text 0x14 [text 0x14 ...] 0x00.
 * The first TAL of every data record is the record's time-keeping TAL (an empty first text).
 */
export interface EdfAnnotation {
  /** Seconds from the file's start date and time (the header's, whole seconds). */
  onset: number;
  /** Seconds; absent when the TAL gives none. */
  duration?: number;
  /** UTF-8 text. */
  text: string;
}

/** The TALs of one record's annotation bytes. */
export interface RecordTals {
  /** Onset of the time-keeping TAL (the record's start), or null when the record has none. */
  recordOnset: number | null;
  annotations: EdfAnnotation[];
}

const ONSET = /^[+-]\d+(?:\.\d+)?$/;
const DURATION = /^\d+(?:\.\d+)?$/;
const utf8 = new TextDecoder('utf-8', { fatal: true });

interface Where {
  file: string;
  record: number;
}

/**
 * Parses the TALs in `bytes` (one record's share of an annotation signal; trailing 0x00 padding is
 * allowed). `firstInRecord` marks bytes that begin a record, whose first TAL is the time-keeping one.
 */
export function parseTals(bytes: Uint8Array, where: Where, firstInRecord = true): RecordTals {
  const annotations: EdfAnnotation[] = [];
  let recordOnset: number | null = null;
  let i = 0;
  let first = firstInRecord;
  while (i < bytes.length && bytes[i] !== 0) {
    const end = bytes.indexOf(0, i);
    if (end < 0) fail(where, 'each TAL to end with byte 0x00', i);
    const tal = bytes.subarray(i, end);
    const head = tal.indexOf(0x14);
    if (head < 0 || tal[tal.length - 1] !== 0x14) fail(where, 'a TAL of the form +onset[0x15 duration]0x14 text 0x14', i);
    const timing = ascii(tal.subarray(0, head));
    const split = timing.indexOf('\x15');
    const onsetText = split < 0 ? timing : timing.slice(0, split);
    const durationText = split < 0 ? undefined : timing.slice(split + 1);
    if (!ONSET.test(onsetText)) fail(where, 'an onset such as "+180" or "-0.5" (sign, digits, optional decimals)', i, onsetText);
    if (durationText !== undefined && !DURATION.test(durationText)) fail(where, 'a duration such as "25.5"', i, durationText);
    const onset = Number(onsetText);
    const duration = durationText === undefined ? undefined : Number(durationText);
    const texts = splitTexts(tal.subarray(head + 1, tal.length - 1), where, i);
    if (first) {
      // Time-keeping TAL: the first text is empty; any further texts are ordinary annotations.
      if (texts[0] !== '') fail(where, 'a time-keeping TAL (empty first annotation) at the start of the record', i, texts[0]);
      recordOnset = onset;
      for (const text of texts.slice(1)) annotations.push(annotation(onset, duration, text));
      first = false;
    } else {
      for (const text of texts) annotations.push(annotation(onset, duration, text));
    }
    i = end + 1;
  }
  return { recordOnset, annotations };
}

function annotation(onset: number, duration: number | undefined, text: string): EdfAnnotation {
  return duration === undefined ? { onset, text } : { onset, duration, text };
}

function splitTexts(bytes: Uint8Array, where: Where, at: number): string[] {
  const out: string[] = [];
  let s = 0;
  for (let k = 0; k <= bytes.length; k++) {
    if (k === bytes.length || bytes[k] === 0x14) {
      try {
        out.push(utf8.decode(bytes.subarray(s, k)));
      } catch {
        fail(where, 'annotation text in UTF-8', at);
      }
      s = k + 1;
    }
  }
  return out;
}

function ascii(bytes: Uint8Array): string {
  let s = '';
  for (const b of bytes) s += String.fromCharCode(b);
  return s;
}

function fail(where: Where, expected: string, offset: number, found?: string): never {
  throw new InputError({
    file: where.file,
    column: `EDF Annotations, data record ${where.record + 1}, byte ${offset}`,
    expected,
    ...(found !== undefined ? { found } : {}),
  });
}

/** Seconds as a TAL number: plain decimal, no exponent, at most 7 decimals, no trailing zeros. */
export function formatTalSeconds(v: number): string {
  const s = Math.abs(v).toFixed(7).replace(/0+$/, '').replace(/\.$/, '');
  return s;
}

/** Encodes one TAL (not the 0x00 padding): +onset[0x15 duration]0x14 text0x14 ... 0x00. */
export function encodeTal(onset: number, duration: number | undefined, texts: readonly string[]): Uint8Array {
  const sign = onset < 0 ? '-' : '+';
  let head = `${sign}${formatTalSeconds(onset)}`;
  if (duration !== undefined) head += `\x15${formatTalSeconds(duration)}`;
  const parts: number[] = [...head].map((c) => c.charCodeAt(0));
  parts.push(0x14);
  for (const t of texts) {
    for (const b of new TextEncoder().encode(t)) {
      if (b === 0x00 || b === 0x14 || b === 0x15) throw new RangeError(`annotation text may not hold bytes 0x00, 0x14 or 0x15: ${JSON.stringify(t)}`);
      parts.push(b);
    }
    parts.push(0x14);
  }
  parts.push(0x00);
  return Uint8Array.from(parts);
}
