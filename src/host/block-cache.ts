import type { ByteSource } from '../core/raw/byte-source';

/**
 * Reads a slow ByteSource (HTTP ranges, IPC) in aligned blocks and keeps the latest few, so the
 * many small reads of a header scan (an EDF+D file's per-record time stamps) cost a handful of
 * requests instead of one each.
 */
export function blockCached(inner: ByteSource, blockBytes = 256 * 1024, keep = 16): ByteSource {
  const blocks = new Map<number, Promise<Uint8Array>>();
  const block = (b: number): Promise<Uint8Array> => {
    let p = blocks.get(b);
    if (p) {
      blocks.delete(b); // re-insert: most recently used last
      blocks.set(b, p);
      return p;
    }
    p = inner.read(b * blockBytes, blockBytes);
    p.catch(() => blocks.delete(b));
    blocks.set(b, p);
    while (blocks.size > keep) blocks.delete(blocks.keys().next().value!);
    return p;
  };
  return {
    size: inner.size,
    async read(offset, length) {
      const from = Math.max(0, offset);
      const to = Math.min(inner.size, offset + length);
      if (to <= from) return new Uint8Array(0);
      const first = Math.floor(from / blockBytes), last = Math.floor((to - 1) / blockBytes);
      if (last - first >= keep) return inner.read(from, to - from); // a large read: straight through
      const parts = await Promise.all(Array.from({ length: last - first + 1 }, (_, i) => block(first + i)));
      if (parts.length === 1) return parts[0].subarray(from - first * blockBytes, to - first * blockBytes);
      const out = new Uint8Array(to - from);
      parts.forEach((part, i) => {
        const base = (first + i) * blockBytes;
        const s = Math.max(from, base), e = Math.min(to, base + part.length);
        if (e > s) out.set(part.subarray(s - base, e - base), s - from);
      });
      return out;
    },
  };
}
