import { closeSync, fsyncSync, openSync, readdirSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Writes a file so that readers see either the old file or the whole new one, even after a crash:
 * the data go to a new temporary file in the same folder, are flushed to disk (fsync), and the
 * temporary file is renamed over the target; the folder is then flushed so the rename lasts.
 * Temporary files of this target left by killed runs (their process is gone) are removed first.
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const temp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
  removeStaleTemps(dirname(path), basename(path));
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

/** Removes ".<name>.<pid>.tmp" files in `dir` whose process no longer runs (a crashed or killed run). */
function removeStaleTemps(dir: string, name: string): void {
  let entries: string[];
  try {
    entries = readdirSync(dir);
  } catch {
    return; // the folder is missing: the write below reports it
  }
  const prefix = `.${name}.`;
  for (const entry of entries) {
    if (!entry.startsWith(prefix) || !entry.endsWith('.tmp')) continue;
    const pid = entry.slice(prefix.length, -'.tmp'.length);
    if (/^\d+$/.test(pid) && Number(pid) !== process.pid && !running(Number(pid))) rmSync(join(dir, entry), { force: true });
  }
}

/** True when a process with this id exists (signal 0 only checks; EPERM: it exists, owned by another user). */
function running(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
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
