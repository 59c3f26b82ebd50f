import { renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Writes a file so that readers see either the old file or the whole new one: the text goes to a
 * temporary file in the same folder, which is then renamed over the target.
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const temp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
  try {
    writeFileSync(temp, data);
    renameSync(temp, path);
  } catch (err) {
    rmSync(temp, { force: true });
    throw err;
  }
}
