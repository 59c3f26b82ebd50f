/**
 * Atomic file writes for exports and studies: write a temporary file in the target folder, fsync,
 * then rename over the target, so a crash leaves either the old file or the new one, never half.
 * The temporary name carries the process id, so that the temporary files a killed process left are
 * removed by the next write of the same target. Node only, no electron (tested in
 * test/host/files-node.test.ts and, killed mid-write, test/host/study-save-crash.test.ts).
 */
import { randomBytes } from 'node:crypto';
import { open, readdir, rename, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

export async function writeFileAtomic(target: string, data: string | Uint8Array): Promise<void> {
  const dir = dirname(target);
  const temp = join(dir, `.${basename(target)}.${process.pid}-${randomBytes(6).toString('hex')}.tmp`);
  await removeStaleTemps(dir, basename(target));
  // 'wx': the temporary name must be new, never an existing file or link.
  const handle = await open(temp, 'wx', 0o644);
  try {
    await handle.writeFile(data);
    await handle.sync();
  } catch (err) {
    await handle.close().catch(() => undefined);
    await unlink(temp).catch(() => undefined);
    throw err;
  }
  await handle.close();
  try {
    await rename(temp, target);
  } catch (err) {
    await unlink(temp).catch(() => undefined);
    throw err;
  }
  await syncFolder(dir);
}

/** Removes ".<name>.<pid>-<hex>.tmp" files in `dir` whose process no longer runs (a crash or a kill). */
async function removeStaleTemps(dir: string, name: string): Promise<void> {
  const entries = await readdir(dir).catch(() => [] as string[]);
  const prefix = `.${name}.`;
  for (const entry of entries) {
    if (!entry.startsWith(prefix) || !entry.endsWith('.tmp')) continue;
    const m = /^(\d+)-[0-9a-f]+$/.exec(entry.slice(prefix.length, -'.tmp'.length));
    if (m && Number(m[1]) !== process.pid && !running(Number(m[1]))) await unlink(join(dir, entry)).catch(() => undefined);
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

/** Makes the rename durable where the platform allows opening a folder (not Windows). */
async function syncFolder(dir: string): Promise<void> {
  if (process.platform === 'win32') return;
  const handle = await open(dir, 'r').catch(() => null);
  if (!handle) return;
  try {
    await handle.sync();
  } catch {
    // Some file systems refuse fsync on folders; the data itself is already synced.
  } finally {
    await handle.close();
  }
}
