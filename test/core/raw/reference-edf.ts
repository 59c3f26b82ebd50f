import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** EDF+ files written by pyedflib, kept in the repository with their source and licence (SOURCE.md, LICENSE there). */
export const REFERENCE_EDF = fileURLToPath(new URL('../../fixtures/edf/', import.meta.url));

export function referenceBytes(name: string): Uint8Array {
  return new Uint8Array(readFileSync(`${REFERENCE_EDF}${name}`));
}
