/**
 * Random-access bytes of one file. The browser supplies one over File.slice, Electron main and the
 * CLI over a file handle, tests over an in-memory array. Readers ask only for the ranges they need.
 */
export interface ByteSource {
  /** File size in bytes. */
  readonly size: number;
  /**
   * The bytes in [offset, offset + length), clipped to the end of the file (a read past the end
   * returns fewer bytes, never throws).
   */
  read(offset: number, length: number): Promise<Uint8Array>;
}

/** A ByteSource over bytes already in memory (tests, small files, drag and drop). */
export function bytesSource(bytes: Uint8Array): ByteSource {
  return {
    size: bytes.length,
    read: (offset, length) => Promise.resolve(bytes.subarray(Math.max(0, offset), Math.min(bytes.length, offset + length))),
  };
}

/** What blobSource needs of a Blob or browser File (structural, so the core names no DOM type). */
export interface SliceableBlob {
  readonly size: number;
  slice(start: number, end: number): { arrayBuffer(): Promise<ArrayBuffer> };
}

/** A ByteSource over a Blob or File (browser, worker, Node): each read is one slice. */
export function blobSource(blob: SliceableBlob): ByteSource {
  return {
    size: blob.size,
    async read(offset, length) {
      const from = Math.max(0, Math.min(blob.size, offset));
      const to = Math.max(from, Math.min(blob.size, offset + length));
      return to === from ? new Uint8Array(0) : new Uint8Array(await blob.slice(from, to).arrayBuffer());
    },
  };
}

/** A ByteSource that counts the bytes and calls passed through it (for tests and benchmarks). */
export interface CountingSource extends ByteSource {
  readonly bytesRead: number;
  readonly reads: number;
  reset(): void;
}

export function countingSource(inner: ByteSource): CountingSource {
  let bytesRead = 0;
  let reads = 0;
  return {
    size: inner.size,
    get bytesRead() {
      return bytesRead;
    },
    get reads() {
      return reads;
    },
    reset() {
      bytesRead = 0;
      reads = 0;
    },
    async read(offset, length) {
      const out = await inner.read(offset, length);
      bytesRead += out.length;
      reads++;
      return out;
    },
  };
}
