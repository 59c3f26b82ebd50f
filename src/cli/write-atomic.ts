import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Writes a file so that readers see either the old file or the whole new one, even after a crash:
 * the data go to a new temporary file in the same folder, are flushed to disk (fsync), and the
 * temporary file is renamed over the target; the folder is then flushed so the rename lasts.
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const temp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
  try {
    rmSync(temp, { force: true }); // a leftover of an interrupted run with the same process id
    // 'wx': the temporary name must be new, never an existing file or link.
    const fd = openSync(temp, 'wx', 0o644);
    try {
      const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
      for (let at = 0; at < bytes.length;) at += writeSync(fd, bytes, at, bytes.length - at);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(temp, path);
  } catch (err) {
    rmSync(temp, { force: true });
    throw err;
  }
  syncFolder(dirname(path));
}

/** Makes the rename durable where a folder can be opened and flushed (not on Windows). */
function syncFolder(dir: string): void {
  if (process.platform === 'win32') return;
  let fd: number;
  try {
    fd = openSync(dir, 'r');
  } catch {
    return;
  }
  try {
    fsyncSync(fd);
  } catch {
    // Some file systems refuse fsync on folders; the data themselves are already flushed.
  } finally {
    closeSync(fd);
  }
}
