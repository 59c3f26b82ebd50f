/**
 * Snappy block decompression, written from the format description (github.com/google/snappy,
 * format_description.txt): a varint of the uncompressed length, then elements. Tag bits 0–1:
 * 00 literal (length-1 in the upper 6 bits, or 60–63 = the length-1 in the next 1–4 bytes,
 * little-endian), 01 copy with length 4–11 and an 11-bit offset, 10 copy with length 1–64 and a
 * 2-byte offset, 11 the same with a 4-byte offset. A copy may overlap its own output (offset
 * smaller than length), which repeats the last `offset` bytes.
 *
 * Literals and non-overlapping copies are moved with TypedArray.set / copyWithin (memcpy), not byte
 * by byte: numeric pages of measured data compress little, so nearly every byte sits in a literal.
 */
export function snappyDecompress(input: Uint8Array, output: Uint8Array): void {
  const inLen = input.length;
  let pos = 0;
  let expected = 0;
  for (let shift = 0; ; shift += 7) {
    if (pos >= inLen || shift > 28) throw new Error('snappy: bad length header');
    const c = input[pos++];
    expected += (c & 0x7f) * 2 ** shift;
    if (c < 0x80) break;
  }
  if (expected !== output.length) throw new Error(`snappy: the data hold ${expected} bytes, ${output.length} expected`);
  let out = 0;
  while (pos < inLen) {
    const tag = input[pos++];
    const kind = tag & 3;
    if (kind === 0) {
      let len = (tag >>> 2) + 1;
      if (len > 60) {
        const extra = len - 60;
        if (pos + extra > inLen) throw new Error('snappy: literal length runs past the input');
        len = 0;
        for (let b = 0; b < extra; b++) len += input[pos + b] * 2 ** (8 * b);
        len += 1;
        pos += extra;
      }
      if (pos + len > inLen) throw new Error('snappy: literal runs past the input');
      if (out + len > output.length) throw new Error('snappy: output longer than its header says');
      if (len < 16) for (let i = 0; i < len; i++) output[out + i] = input[pos + i];
      else output.set(input.subarray(pos, pos + len), out);
      pos += len;
      out += len;
      continue;
    }
    let len: number;
    let offset: number;
    if (kind === 1) {
      if (pos >= inLen) throw new Error('snappy: copy runs past the input');
      len = ((tag >>> 2) & 7) + 4;
      offset = ((tag >>> 5) << 8) | input[pos++];
    } else if (kind === 2) {
      if (pos + 2 > inLen) throw new Error('snappy: copy runs past the input');
      len = (tag >>> 2) + 1;
      offset = input[pos] | (input[pos + 1] << 8);
      pos += 2;
    } else {
      if (pos + 4 > inLen) throw new Error('snappy: copy runs past the input');
      len = (tag >>> 2) + 1;
      offset = (input[pos] | (input[pos + 1] << 8) | (input[pos + 2] << 16)) + input[pos + 3] * 2 ** 24;
      pos += 4;
    }
    if (offset === 0 || offset > out) throw new Error(`snappy: copy offset ${offset} at output byte ${out} is out of range`);
    if (out + len > output.length) throw new Error('snappy: output longer than its header says');
    const from = out - offset;
    if (offset >= len && len >= 16) output.copyWithin(out, from, from + len);
    else for (let i = 0; i < len; i++) output[out + i] = output[from + i];
    out += len;
  }
  if (out !== output.length) throw new Error(`snappy: the data end after ${out} of ${output.length} bytes`);
}
