/** The study-file payload checks and autosave file format of electron/validate-study.ts (Node only). */
import { describe, expect, it } from 'vitest';
import { packAutosave, unpackAutosave, validateAutosave, validateKey, validateRecentName, validateStudySave } from '../../electron/validate-study.ts';

const KEY = 'a'.repeat(64);
const entry = { key: KEY, studyName: 'home.gleaner', inputName: 'windows.csv', savedAt: 1_700_000_000_000, bytes: new Uint8Array([80, 75, 3, 4, 9]) };

describe('validateStudySave(args)', () => {
  it('accepts a plain .gleaner name, bytes and a saveAs flag', () => {
    expect(validateStudySave(['home.gleaner', new Uint8Array(3), true])).toEqual({ name: 'home.gleaner', bytes: new Uint8Array(3), saveAs: true });
  });

  it('refuses paths, other extensions, text instead of bytes and missing flags, naming what was expected', () => {
    expect(() => validateStudySave(['../home.gleaner', new Uint8Array(1), false])).toThrow(/plain file name/);
    expect(() => validateStudySave(['home.csv', new Uint8Array(1), false])).toThrow(/should end with \.gleaner/);
    expect(() => validateStudySave(['home.gleaner', 'PK', false])).toThrow(/as bytes/);
    expect(() => validateStudySave(['home.gleaner', new Uint8Array(1)])).toThrow(/expected 3 arguments, found 2/);
    expect(() => validateStudySave(['home.gleaner', new Uint8Array(1), 'yes'])).toThrow(/true or false/);
  });
});

describe('autosave requests', () => {
  it('checks keys as lowercase hex SHA-256 (64 characters, common practice)', () => {
    expect(validateKey('readAutosave', KEY)).toBe(KEY);
    expect(() => validateKey('readAutosave', '../x')).toThrow(/SHA-256/);
    expect(() => validateKey('readAutosave', 'A'.repeat(64))).toThrow(/lowercase/);
  });

  it('accepts a recent study name or null', () => {
    expect(validateRecentName([null])).toBeNull();
    expect(validateRecentName(['home.gleaner'])).toBe('home.gleaner');
    expect(() => validateRecentName(['/etc/passwd'])).toThrow(/plain file name/);
  });

  it('refuses an autosave with a bad time or input name', () => {
    expect(() => validateAutosave([{ ...entry, savedAt: Number.NaN }])).toThrow(/savedAt/);
    expect(() => validateAutosave([{ ...entry, inputName: 'a/b.csv' }])).toThrow(/input name/);
  });

  it('packs and unpacks an autosave file exactly, and rejects a truncated one', () => {
    const packed = packAutosave(entry);
    expect(unpackAutosave(packed)).toEqual(entry);
    expect(unpackAutosave(packed.subarray(0, 10))).toBeNull();
    expect(unpackAutosave(new Uint8Array(2))).toBeNull();
  });
});
