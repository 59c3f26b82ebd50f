import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The shared reference folder, outside the repository: ../shared/reference/edf (see its SOURCE.md). */
export const REFERENCE_EDF = fileURLToPath(new URL('../../../../shared/reference/edf/', import.meta.url));
export const HAVE_REFERENCE = existsSync(REFERENCE_EDF);
if (!HAVE_REFERENCE) console.warn(`skipping EDF reference-file tests: ${REFERENCE_EDF} is absent (it lives beside the repository, not in it)`);

export function referenceBytes(name: string): Uint8Array {
  return new Uint8Array(readFileSync(`${REFERENCE_EDF}${name}`));
}
