import { ByteBuffer } from 'flatbuffers';

/**
 * apache-arrow decodes IPC metadata with the flatbuffers library, which trusts every vector length
 * it reads: a damaged length of 2^31 made it decode two billion garbage fields (a hang). Installed
 * once, this makes a vector length that cannot fit in its buffer an error instead. A vector's
 * elements take at least one byte each, so every valid flatbuffer passes (FlatBuffers internals:
 * a vector is a uint32 length followed by its elements).
 */
export function boundFlatbufferVectors(): void {
  const proto = ByteBuffer.prototype as ByteBuffer & { __boundedVectors?: true };
  if (proto.__boundedVectors) return;
  const vectorLength = proto.__vector_len;
  proto.__vector_len = function boundedVectorLength(this: ByteBuffer, offset: number): number {
    const length = vectorLength.call(this, offset);
    const start = offset + this.readInt32(offset) + 4;
    if (length < 0 || start < 0 || start + length > this.capacity()) {
      throw new Error(`a metadata list inside the file (${length} entries at byte ${start} of ${this.capacity()})`);
    }
    return length;
  };
  proto.__boundedVectors = true;
}
