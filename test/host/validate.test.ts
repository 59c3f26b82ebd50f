// Tests of the Electron bridge's payload rules (electron/validate.ts, pure, no electron import).
import { describe, expect, it } from 'vitest';
import { ALLOWED_EXTENSIONS, extensionOf, PayloadError, plainNameProblem, SAVE_LIMITS, utf8Length, validateNoArguments, validateSaveRequest } from '../../electron/validate.ts';

const csv = (name: string, data: string | Uint8Array = 'a,b\n1,2\n') => ({ name, data });

describe('plainNameProblem(name)', () => {
  it('accepts plain export names', () => {
    for (const name of ['labels.csv', 'events.tsv', 'provenance.json', 'map figure.svg', 'study-2024_05.json', 'ännotations.edf']) {
      expect(plainNameProblem(name), name).toBeNull();
    }
  });

  it('refuses path separators of every platform and parent references', () => {
    // Path syntax (POSIX '/' and Windows '\\' and drive ':'): common practice.
    for (const name of ['../labels.csv', '..\\labels.csv', 'a/b.csv', 'a\\b.csv', 'C:labels.csv', '/etc/passwd', '..', '.', 'x..csv']) {
      expect(plainNameProblem(name), name).not.toBeNull();
    }
  });

  it('refuses Windows device names, trailing dots and spaces, and control characters', () => {
    // Reserved names and trailing dot/space: Microsoft Learn, "Naming Files, Paths, and Namespaces" (from memory).
    for (const name of ['CON', 'nul.csv', 'com1.json', 'LPT9.tsv', 'labels.csv.', 'labels.csv ', ' labels.csv', 'a\u0000.csv', 'a\nb.csv', 'a*.csv', 'a?.csv', 'a|b.csv', 'a"b.csv', 'a<b.csv']) {
      expect(plainNameProblem(name), JSON.stringify(name)).not.toBeNull();
    }
    // Device names only match the whole stem: these are ordinary names.
    expect(plainNameProblem('console.csv')).toBeNull();
    expect(plainNameProblem('com10.csv')).toBeNull();
  });

  it('refuses empty and overlong names', () => {
    expect(plainNameProblem('')).toBe('is empty');
    expect(plainNameProblem(`${'a'.repeat(SAVE_LIMITS.maxNameLength - 4)}.csv`)).toBeNull();
    expect(plainNameProblem(`${'a'.repeat(SAVE_LIMITS.maxNameLength - 3)}.csv`)).toMatch(/longer than/);
  });
});

describe('extensionOf(name)', () => {
  it('is the lower-case last extension, empty for dot files and bare names', () => {
    expect(extensionOf('labels.CSV')).toBe('.csv');
    expect(extensionOf('a.tar.json')).toBe('.json');
    expect(extensionOf('.csv')).toBe('');
    expect(extensionOf('labels')).toBe('');
  });
});

describe('utf8Length(s)', () => {
  it('agrees with TextEncoder on ASCII, accents, CJK, emoji and lone surrogates', () => {
    // Reference: the WHATWG Encoding Standard's UTF-8 encoder as shipped in Node 20 (TextEncoder),
    // which writes a lone surrogate as U+FFFD (3 bytes).
    const enc = new TextEncoder();
    for (const s of ['', 'window_id,subject\n', 'Müller', '中文测试八个字', 'ok 👍🏽', '\ud800x', 'x\udc00', '\ud83d']) {
      expect(utf8Length(s), JSON.stringify(s)).toBe(enc.encode(s).length);
    }
  });
});

describe('validateSaveRequest(suggestedFolder, files)', () => {
  it('returns a valid request unchanged, text and bytes alike', () => {
    const bytes = new Uint8Array([0x30, 0x20, 0x20]);
    const r = validateSaveRequest('gleaner-labels', [csv('labels.csv'), { name: 'annotations.edf', data: bytes }]);
    expect(r.suggestedFolder).toBe('gleaner-labels');
    expect(r.files.map((f) => f.name)).toEqual(['labels.csv', 'annotations.edf']);
    expect(r.files[1].data).toBe(bytes);
  });

  it('accepts every allowed extension, in any case, and an empty suggested folder', () => {
    const files = ALLOWED_EXTENSIONS.map((ext, i) => csv(`f${i}${i % 2 ? ext.toUpperCase() : ext}`));
    expect(validateSaveRequest('', files).files).toHaveLength(ALLOWED_EXTENSIONS.length);
  });

  it('refuses a suggested folder that is not a string or not a plain name', () => {
    expect(() => validateSaveRequest(42, [csv('a.csv')])).toThrow(/suggested folder to be a string, found number/);
    expect(() => validateSaveRequest('../../etc', [csv('a.csv')])).toThrow(PayloadError);
    expect(() => validateSaveRequest('/home/me', [csv('a.csv')])).toThrow(/plain folder name/);
  });

  it('refuses a files argument that is not a non-empty array of {name, data}', () => {
    expect(() => validateSaveRequest('x', 'labels.csv')).toThrow(/expected an array of files, found "labels.csv"/);
    expect(() => validateSaveRequest('x', [])).toThrow(/at least one file/);
    expect(() => validateSaveRequest('x', [null])).toThrow(/file 1: expected an object \{name, data\}, found null/);
    expect(() => validateSaveRequest('x', [csv('a.csv'), ['a.csv', 'x']])).toThrow(/file 2: expected an object/);
    expect(() => validateSaveRequest('x', [{ data: 'x' }])).toThrow(/file 1: expected the name to be a string, found undefined/);
  });

  it('names the file and the problem for unsafe names', () => {
    expect(() => validateSaveRequest('x', [csv('ok.csv'), csv('../evil.csv')])).toThrow(/file 2 "..\/evil.csv": the name .*expected a plain file name/);
    expect(() => validateSaveRequest('x', [csv('sub/labels.csv')])).toThrow(PayloadError);
    expect(() => validateSaveRequest('x', [csv('C:\\Users\\me\\labels.csv')])).toThrow(PayloadError);
  });

  it('refuses extensions outside the allowed list, and names without one', () => {
    expect(() => validateSaveRequest('x', [csv('run.sh')])).toThrow(/expected one of \.csv \.json \.tsv \.edf \.svg \.png \.html, found \.sh/);
    expect(() => validateSaveRequest('x', [csv('labels.csv.exe')])).toThrow(/found \.exe/);
    expect(() => validateSaveRequest('x', [csv('README')])).toThrow(/found no extension/);
  });

  it('refuses the same name twice, ignoring case', () => {
    expect(() => validateSaveRequest('x', [csv('labels.csv'), csv('LABELS.csv')])).toThrow(/file 2 "LABELS.csv": expected each name once/);
  });

  it('refuses data that is neither text nor bytes', () => {
    for (const data of [123, null, undefined, [1, 2], { length: 2 }, new ArrayBuffer(4), new Float32Array(2)]) {
      expect(() => validateSaveRequest('x', [{ name: 'a.csv', data }]), String(data)).toThrow(/expected data as text or bytes/);
    }
  });

  it('enforces the file-count and size limits', () => {
    const many = Array.from({ length: SAVE_LIMITS.maxFiles + 1 }, (_, i) => csv(`f${i}.csv`));
    expect(() => validateSaveRequest('x', many)).toThrow(/at most 32 files, found 33/);
    expect(validateSaveRequest('x', many.slice(1)).files).toHaveLength(SAVE_LIMITS.maxFiles);
    // A typed-array view over a large buffer costs no memory to allocate per byte here.
    const big = new Uint8Array(SAVE_LIMITS.maxFileBytes + 1);
    expect(() => validateSaveRequest('x', [{ name: 'big.png', data: big }])).toThrow(/big.png": expected at most 536870912 bytes, found 536870913/);
    const half = new Uint8Array(SAVE_LIMITS.maxFileBytes);
    expect(() => validateSaveRequest('x', [{ name: 'a.png', data: half }, { name: 'b.png', data: half }, { name: 'c.png', data: new Uint8Array(1) }])).toThrow(/at most 1073741824 bytes in one save, found more by file 3/);
  });
});

describe('validateNoArguments(method, args)', () => {
  it('accepts none and refuses any', () => {
    expect(() => validateNoArguments('loadDemo', [])).not.toThrow();
    expect(() => validateNoArguments('loadDemo', ['/etc/passwd'])).toThrow(/loadDemo: expected no arguments, found 1/);
  });
});
