import type { ByteSource } from '../raw/byte-source';

/** Anything that digests bytes fed in order (the core's SHA-256, Node's crypto Hash). */
export interface Digest {
  update(bytes: Uint8Array): unknown;
}

export interface HashingSource extends ByteSource {
  /** Feeds the digest the bytes no read has covered yet (up to the end of the file). */
  finish(): Promise<void>;
}

/**
 * A ByteSource that feeds every byte of the file to `digest` exactly once, in file order, while
 * a reader reads by offset: a read that starts at (or a little after) the hashed prefix extends
 * it, filling a gap of at most `maxGap` bytes with one extra read; reads elsewhere (a footer read
 * first) are served but not hashed until `finish`, which reads whatever is left. When the reader
 * goes through the file front to back, as a row-group reader does, the file is read once.
 */
export function hashingSource(inner: ByteSource, digest: Digest, maxGap = 1 << 20): HashingSource {
  let hashed = 0;
  let queue: Promise<void> = Promise.resolve();
  const absorb = async (offset: number, bytes: Uint8Array): Promise<void> => {
    if (offset > hashed) {
      if (offset - hashed > maxGap) return;
      const gap = await inner.read(hashed, offset - hashed);
      digest.update(gap);
      hashed += gap.length;
      if (hashed !== offset) return;
    }
    const end = offset + bytes.length;
    if (end <= hashed) return;
    digest.update(bytes.subarray(hashed - offset));
    hashed = end;
  };
  return {
    size: inner.size,
    async read(offset, length) {
      const bytes = await inner.read(offset, length);
      queue = queue.then(() => absorb(offset, bytes));
      await queue;
      return bytes;
    },
    async finish() {
      await queue;
      const chunk = 4 << 20;
      while (hashed < inner.size) {
        const bytes = await inner.read(hashed, Math.min(chunk, inner.size - hashed));
        if (bytes.length === 0) break;
        digest.update(bytes);
        hashed += bytes.length;
      }
    },
  };
}
