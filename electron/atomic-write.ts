/**
 * Atomic file writes for exports and studies: write a temporary file in the target folder, fsync,
 * then rename over the target, so a crash leaves either the old file or the new one, never half.
 * Node only, no electron (tested in test/host/atomic-write.test.ts).
 */
import { randomBytes } from 'node:crypto';
import { open, rename, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

export async function writeFileAtomic(target: string, data: string | Uint8Array): Promise<void> {
  const dir = dirname(target);
  const temp = join(dir, `.${basename(target)}.${randomBytes(6).toString('hex')}.tmp`);
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
