/**
 * Payload checks for the study-file requests (save, open recent, autosave). Pure: no electron, no
 * fs, so they are unit-tested in Node (test/host/validate-study.test.ts).
 */
import type { BridgeAutosave } from './bridge.types.ts';
import { PayloadError, plainNameProblem } from './validate.ts';

export const STUDY_EXTENSION = '.gleaner';
export const AUTOSAVE_SUFFIX = '.autosave';
/** Largest study file or autosave accepted through the bridge (bytes). */
export const MAX_STUDY_BYTES = 1024 * 1024 * 1024;

export interface StudySaveRequest {
  name: string;
  bytes: Uint8Array;
  saveAs: boolean;
}

function studyName(method: string, name: unknown): string {
  if (typeof name !== 'string') throw new PayloadError(`${method}: expected the study name to be a string, found ${typeof name}`);
  const problem = plainNameProblem(name);
  if (problem) throw new PayloadError(`${method}: the study name ${JSON.stringify(name)} ${problem}; expected a plain file name`);
  if (!name.toLowerCase().endsWith(STUDY_EXTENSION)) {
    throw new PayloadError(`${method}: the study name ${JSON.stringify(name)} should end with ${STUDY_EXTENSION}`);
  }
  return name;
}

function studyBytes(method: string, bytes: unknown): Uint8Array {
  if (!(bytes instanceof Uint8Array)) throw new PayloadError(`${method}: expected the study as bytes, found ${typeof bytes}`);
  if (bytes.byteLength > MAX_STUDY_BYTES) throw new PayloadError(`${method}: expected at most ${MAX_STUDY_BYTES} bytes, found ${bytes.byteLength}`);
  return bytes;
}

/** saveStudy(name, bytes, saveAs). */
export function validateStudySave(args: readonly unknown[]): StudySaveRequest {
  if (args.length !== 3) throw new PayloadError(`saveStudy: expected 3 arguments, found ${args.length}`);
  if (typeof args[2] !== 'boolean') throw new PayloadError(`saveStudy: expected saveAs to be true or false, found ${typeof args[2]}`);
  return { name: studyName('saveStudy', args[0]), bytes: studyBytes('saveStudy', args[1]), saveAs: args[2] };
}

/** A SHA-256 in lowercase hex: the key of an autosave. */
export function validateKey(method: string, key: unknown): string {
  if (typeof key !== 'string' || !/^[0-9a-f]{64}$/.test(key)) {
    throw new PayloadError(`${method}: expected the key to be a SHA-256 in lowercase hex (64 characters)`);
  }
  return key;
}

/** openStudy(recent): null, or one of the names the recent list holds (checked by the caller). */
export function validateRecentName(args: readonly unknown[]): string | null {
  if (args.length !== 1) throw new PayloadError(`openStudy: expected 1 argument, found ${args.length}`);
  return args[0] === null ? null : studyName('openStudy', args[0]);
}

/** writeAutosave(entry). */
export function validateAutosave(args: readonly unknown[]): BridgeAutosave {
  if (args.length !== 1) throw new PayloadError(`writeAutosave: expected 1 argument, found ${args.length}`);
  const e = args[0] as Partial<BridgeAutosave> | null;
  if (typeof e !== 'object' || e === null) throw new PayloadError('writeAutosave: expected an object {key, studyName, inputName, savedAt, bytes}');
  const key = validateKey('writeAutosave', e.key);
  const name = e.studyName === null ? null : studyName('writeAutosave', e.studyName);
  if (typeof e.inputName !== 'string' || plainNameProblem(e.inputName) !== null) {
    throw new PayloadError('writeAutosave: expected the input name to be a plain file name');
  }
  if (typeof e.savedAt !== 'number' || !Number.isFinite(e.savedAt) || e.savedAt < 0) {
    throw new PayloadError('writeAutosave: expected savedAt to be a time in milliseconds');
  }
  return { key, studyName: name, inputName: e.inputName, savedAt: e.savedAt, bytes: studyBytes('writeAutosave', e.bytes) };
}

/**
 * The autosave file format: 4 bytes (little-endian length L), L bytes of UTF-8 JSON
 * {key, studyName, inputName, savedAt}, then the study bytes.
 */
export function packAutosave(entry: BridgeAutosave): Uint8Array {
  const meta = new TextEncoder().encode(JSON.stringify({ key: entry.key, studyName: entry.studyName, inputName: entry.inputName, savedAt: entry.savedAt }));
  const out = new Uint8Array(4 + meta.length + entry.bytes.length);
  new DataView(out.buffer).setUint32(0, meta.length, true);
  out.set(meta, 4);
  out.set(entry.bytes, 4 + meta.length);
  return out;
}

/** Reads an autosave file back; null when it is not one (truncated or foreign). */
export function unpackAutosave(bytes: Uint8Array): BridgeAutosave | null {
  if (bytes.length < 4) return null;
  const length = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength).getUint32(0, true);
  if (4 + length > bytes.length) return null;
  try {
    const meta = JSON.parse(new TextDecoder().decode(bytes.subarray(4, 4 + length))) as Omit<BridgeAutosave, 'bytes'>;
    const entry = { ...meta, bytes: bytes.slice(4 + length) };
    return validateAutosave([entry]);
  } catch {
    return null;
  }
}
