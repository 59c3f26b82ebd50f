import { open, type FileHandle } from 'node:fs/promises';
import type { ByteSource } from '../core/raw/byte-source';

/** A ByteSource over a file on disk (positioned reads on one handle); close it when done. */
export interface FileSource extends ByteSource {
  close(): Promise<void>;
}

export async function openFileSource(path: string): Promise<FileSource> {
  const handle: FileHandle = await open(path, 'r');
  const { size } = await handle.stat();
  return {
    size,
    async read(offset, length) {
      const from = Math.max(0, offset);
      const n = Math.max(0, Math.min(length, size - from));
      const out = new Uint8Array(n);
      let got = 0;
      while (got < n) {
        const { bytesRead } = await handle.read(out, got, n - got, from + got);
        if (bytesRead === 0) break;
        got += bytesRead;
      }
      return got === n ? out : out.subarray(0, got);
    },
    close: () => handle.close(),
  };
}
