/**
 * Payload validation for everything the renderer sends to main. Pure: no electron, no fs, so the
 * rules are unit-tested in Node (test/host/validate.test.ts). Main trusts nothing it did not check
 * here: a compromised renderer must not be able to write outside the folder the user picked, write
 * odd file types, or exhaust memory.
 */
import type { BridgeFileToWrite } from './bridge.types.ts';

/** A renderer request that breaks the rules below; the message says what was expected. */
export class PayloadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PayloadError';
  }
}

/** File types the app writes: weak labels, events, provenance, study, EDF+ annotations, figures. */
export const ALLOWED_EXTENSIONS = ['.csv', '.json', '.tsv', '.edf', '.svg', '.png', '.html'] as const;

export const SAVE_LIMITS = {
  /** Files in one save. */
  maxFiles: 32,
  /** Bytes per file (UTF-8 for text). */
  maxFileBytes: 512 * 1024 * 1024,
  /** Bytes in one save, all files together. */
  maxTotalBytes: 1024 * 1024 * 1024,
  /** Characters in a file or folder name. */
  maxNameLength: 200,
} as const;

export interface SaveRequest {
  suggestedFolder: string;
  files: BridgeFileToWrite[];
}

// Names Windows reserves whatever the extension; refused everywhere so exports travel.
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\..*)?$/i;
// Path separators, Windows-forbidden characters and control characters.
// eslint-disable-next-line no-control-regex
const FORBIDDEN_CHARS = /[/\\:*?"<>|\u0000-\u001f\u007f]/;

/**
 * Why `name` is not a plain file or folder name, or null when it is: no directories, no '.' or
 * '..', no characters some platform forbids, no trailing dot or space, not a reserved device name.
 */
export function plainNameProblem(name: string, maxLength: number = SAVE_LIMITS.maxNameLength): string | null {
  if (name.length === 0) return 'is empty';
  if (name.length > maxLength) return `is longer than ${maxLength} characters`;
  if (FORBIDDEN_CHARS.test(name)) return 'contains a path separator or a character not allowed in file names';
  if (name === '.' || name === '..' || name.includes('..')) return "contains '..'";
  if (/[. ]$/.test(name) || /^ /.test(name)) return 'starts with a space or ends with a dot or space';
  if (RESERVED.test(name)) return 'is a name reserved by Windows';
  return null;
}

/** The lower-case extension of a plain name, including the dot ('' when there is none). */
export function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot <= 0 ? '' : name.slice(dot).toLowerCase();
}

/** UTF-8 length of a string without encoding it (lone surrogates count 3, as TextEncoder writes U+FFFD). */
export function utf8Length(s: string): number {
  let bytes = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < s.length) {
      const next = s.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) {
        bytes += 4;
        i++;
      } else bytes += 3;
    } else bytes += 3;
  }
  return bytes;
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (value instanceof Uint8Array) return 'bytes';
  return typeof value === 'string' ? JSON.stringify(value.length > 40 ? `${value.slice(0, 37)}...` : value) : typeof value;
}

/**
 * Checks the arguments of saveFiles(suggestedFolder, files) and returns them typed. Throws a
 * PayloadError naming the file (by position and name) and what was expected.
 */
export function validateSaveRequest(suggestedFolder: unknown, files: unknown): SaveRequest {
  if (typeof suggestedFolder !== 'string') {
    throw new PayloadError(`saveFiles: expected the suggested folder to be a string, found ${describe(suggestedFolder)}`);
  }
  if (suggestedFolder !== '') {
    const problem = plainNameProblem(suggestedFolder);
    if (problem) throw new PayloadError(`saveFiles: the suggested folder ${JSON.stringify(suggestedFolder)} ${problem}; expected a plain folder name`);
  }
  if (!Array.isArray(files)) throw new PayloadError(`saveFiles: expected an array of files, found ${describe(files)}`);
  if (files.length === 0) throw new PayloadError('saveFiles: expected at least one file, found none');
  if (files.length > SAVE_LIMITS.maxFiles) {
    throw new PayloadError(`saveFiles: expected at most ${SAVE_LIMITS.maxFiles} files, found ${files.length}`);
  }
  const seen = new Set<string>();
  const out: BridgeFileToWrite[] = [];
  let total = 0;
  files.forEach((file: unknown, i) => {
    const at = `saveFiles: file ${i + 1}`;
    if (typeof file !== 'object' || file === null || Array.isArray(file)) {
      throw new PayloadError(`${at}: expected an object {name, data}, found ${describe(file)}`);
    }
    const { name, data } = file as { name?: unknown; data?: unknown };
    if (typeof name !== 'string') throw new PayloadError(`${at}: expected the name to be a string, found ${describe(name)}`);
    const problem = plainNameProblem(name);
    if (problem) throw new PayloadError(`${at} ${JSON.stringify(name)}: the name ${problem}; expected a plain file name`);
    const ext = extensionOf(name);
    if (!(ALLOWED_EXTENSIONS as readonly string[]).includes(ext)) {
      throw new PayloadError(`${at} ${JSON.stringify(name)}: expected one of ${ALLOWED_EXTENSIONS.join(' ')}, found ${ext === '' ? 'no extension' : ext}`);
    }
    // Case-insensitive file systems (Windows, macOS) would make two of these one file.
    const key = name.toLowerCase();
    if (seen.has(key)) throw new PayloadError(`${at} ${JSON.stringify(name)}: expected each name once, found it twice`);
    seen.add(key);
    let size: number;
    if (typeof data === 'string') size = utf8Length(data);
    else if (data instanceof Uint8Array) size = data.byteLength;
    else throw new PayloadError(`${at} ${JSON.stringify(name)}: expected data as text or bytes, found ${describe(data)}`);
    if (size > SAVE_LIMITS.maxFileBytes) {
      throw new PayloadError(`${at} ${JSON.stringify(name)}: expected at most ${SAVE_LIMITS.maxFileBytes} bytes, found ${size}`);
    }
    total += size;
    if (total > SAVE_LIMITS.maxTotalBytes) {
      throw new PayloadError(`saveFiles: expected at most ${SAVE_LIMITS.maxTotalBytes} bytes in one save, found more by file ${i + 1}`);
    }
    out.push({ name, data });
  });
  return { suggestedFolder, files: out };
}

/** Checks that an invoke carried no arguments (openWindowsFile, loadDemo). */
export function validateNoArguments(method: string, args: readonly unknown[]): void {
  if (args.length !== 0) throw new PayloadError(`${method}: expected no arguments, found ${args.length}`);
}
