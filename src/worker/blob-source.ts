import type { ByteSource } from '../core/raw/byte-source';

/** Random-access bytes of a Blob (a browser File): each read is one Blob.slice. */
export function blobSource(blob: Blob): ByteSource {
  return {
    size: blob.size,
    async read(offset, length) {
      const from = Math.max(0, Math.min(blob.size, offset));
      const to = Math.max(from, Math.min(blob.size, offset + length));
      return new Uint8Array(await blob.slice(from, to).arrayBuffer());
    },
  };
}
