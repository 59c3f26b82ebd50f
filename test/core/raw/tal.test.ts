import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { encodeTal, parseTals } from '../../../src/core/raw/edf/tal';

const where = { file: 'x.edf', record: 0 };
const bytes = (...parts: (string | number)[]) =>
  Uint8Array.from(parts.flatMap((p) => (typeof p === 'number' ? [p] : [...new TextEncoder().encode(p)])));

describe('parseTals / encodeTal (EDF+ specification, Kemp & Olivan 2003, section 2.2.2 examples)', () => {
  it('parses the spec example "+180" 0x14 "Lights off" 0x14 "Close door" 0x14 0x00 (28 bytes)', () => {
    const tal = bytes('+180', 0x14, 'Lights off', 0x14, 'Close door', 0x14, 0x00);
    expect(tal.length).toBe(28); // the spec counts 28 bytes
    expect(parseTals(tal, where, false).annotations).toEqual([
      { onset: 180, text: 'Lights off' },
      { onset: 180, text: 'Close door' },
    ]);
    expect(encodeTal(180, undefined, ['Lights off', 'Close door'])).toEqual(tal);
  });

  it('parses the spec example "+1800.2" 0x15 "25.5" 0x14 "Apnea" 0x14 0x00 with its duration', () => {
    const tal = bytes('+1800.2', 0x15, '25.5', 0x14, 'Apnea', 0x14, 0x00);
    expect(parseTals(tal, where, false).annotations).toEqual([{ onset: 1800.2, duration: 25.5, text: 'Apnea' }]);
    expect(encodeTal(1800.2, 25.5, ['Apnea'])).toEqual(tal);
  });

  it('reads the time-keeping TAL "+567" 0x14 0x14 0x00 of a record, then its annotations, ignoring 0x00 padding', () => {
    const rec = bytes('+567', 0x14, 0x14, 0x00, '+568.5', 0x14, 'Arousal', 0x14, 0x00, 0x00, 0x00, 0x00);
    expect(parseTals(rec, where)).toEqual({ recordOnset: 567, annotations: [{ onset: 568.5, text: 'Arousal' }] });
  });

  it('rejects a TAL with a malformed onset, naming the record and byte', () => {
    expect(() => parseTals(bytes('180', 0x14, 0x14, 0x00), where)).toThrow(InputError);
    expect(() => parseTals(bytes('180', 0x14, 0x14, 0x00), where)).toThrow(/data record 1, byte 0.*onset/);
  });

  it('rejects a record whose first TAL is not time-keeping', () => {
    expect(() => parseTals(bytes('+1', 0x14, 'text', 0x14, 0x00), where)).toThrow(/time-keeping/);
  });

  it('refuses annotation text holding TAL delimiters', () => {
    expect(() => encodeTal(0, undefined, ['a\x14b'])).toThrow(/0x14/);
  });
});
