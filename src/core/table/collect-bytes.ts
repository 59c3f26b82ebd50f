/**
 * Gathers chunks into one byte buffer for formats that must see the whole file (Parquet keeps its
 * schema in a footer, Arrow IPC in its first message): sized once when the total is known.
 */
export class ByteCollector {
  private buf: Uint8Array;
  private size = 0;

  constructor(totalBytes = 0) {
    this.buf = new Uint8Array(Math.max(totalBytes, 1 << 16));
  }

  push(chunk: Uint8Array): void {
    if (this.size + chunk.length > this.buf.length) {
      const next = new Uint8Array(Math.max(this.buf.length * 2, this.size + chunk.length));
      next.set(this.buf.subarray(0, this.size));
      this.buf = next;
    }
    this.buf.set(chunk, this.size);
    this.size += chunk.length;
  }

  get length(): number {
    return this.size;
  }

  /** The bytes as an exactly sized ArrayBuffer (no copy when the total was known). */
  take(): ArrayBuffer {
    const b = this.buf.length === this.size ? this.buf : this.buf.slice(0, this.size);
    this.buf = new Uint8Array(0);
    return b.buffer as ArrayBuffer;
  }
}
