import type { Study } from './study.types';

export interface InputCheck {
  input: number;
  fileName: string;
  status: 'same' | 'changed' | 'missing';
  expected: string;
  /** Hash found now ('' when the file is missing). */
  found: string;
  message: string;
}

/**
 * Compares each input's recorded SHA-256 with the hash of the file as it is now (computed by the
 * caller; undefined when the file cannot be found). A changed hash means the saved results may not
 * belong to the data any more.
 */
export function checkInputs(study: Pick<Study, 'inputs'>, currentHashes: readonly (string | undefined)[]): InputCheck[] {
  return study.inputs.map((input, i) => {
    const found = currentHashes[i];
    const base = { input: i, fileName: input.fileName, expected: input.sha256, found: found ?? '' };
    if (found === undefined) return { ...base, status: 'missing', message: `${input.fileName}: not found at ${input.path}` };
    if (found.toLowerCase() !== input.sha256.toLowerCase()) {
      return { ...base, status: 'changed', message: `${input.fileName}: changed since the study was saved (SHA-256 ${input.sha256.slice(0, 12)}… recorded, ${found.slice(0, 12)}… now)` };
    }
    return { ...base, status: 'same', message: `${input.fileName}: unchanged` };
  });
}
