import { snappyUncompress } from 'hyparquet';
import { describe, expect, it } from 'vitest';
import { seededRandom, type Random } from '../../../src/core/random';
import { snappyDecompress } from '../../../src/core/table/snappy';

const decode = (bytes: number[], size: number) => {
  const out = new Uint8Array(size);
  snappyDecompress(Uint8Array.from(bytes), out);
  return out;
};

/** A valid random Snappy stream (format_description.txt) and the bytes it stands for. */
function randomStream(random: Random): { input: Uint8Array; output: Uint8Array } {
  const out: number[] = [];
  const body: number[] = [];
  const pick = (n: number) => Math.floor(random() * n);
  const elements = 1 + pick(40);
  for (let e = 0; e < elements; e++) {
    const kind = out.length === 0 ? 0 : pick(4);
    if (kind === 0) {
      // Literal: short lengths in the tag, longer ones in 1–4 extra bytes (tag values 60–63).
      const len = [1 + pick(60), 61 + pick(200), 256 + pick(70_000)][pick(3)];
      if (len <= 60) body.push((len - 1) << 2);
      else {
        const n = len - 1;
        const extra = n < 256 ? 1 : n < 65_536 ? 2 : 3;
        body.push((59 + extra) << 2);
        for (let b = 0; b < extra; b++) body.push((n >>> (8 * b)) & 0xff);
      }
      for (let i = 0; i < len; i++) {
        const v = pick(256);
        body.push(v);
        out.push(v);
      }
      continue;
    }
    const offset = 1 + pick(Math.min(out.length, kind === 1 ? 2047 : 70_000));
    const len = kind === 1 ? 4 + pick(8) : 1 + pick(64);
    if (kind === 1) body.push(((offset >>> 8) << 5) | ((len - 4) << 2) | 1, offset & 0xff);
    else if (kind === 2 && offset < 65_536) body.push(((len - 1) << 2) | 2, offset & 0xff, offset >>> 8);
    else body.push(((len - 1) << 2) | 3, offset & 0xff, (offset >>> 8) & 0xff, (offset >>> 16) & 0xff, offset >>> 24);
    // Overlapping copies (offset < len) repeat the last `offset` bytes.
    for (let i = 0; i < len; i++) out.push(out[out.length - offset]);
  }
  const header: number[] = [];
  for (let n = out.length; ; n = Math.floor(n / 128)) {
    if (n < 128) { header.push(n); break; }
    header.push((n & 0x7f) | 0x80);
  }
  return { input: Uint8Array.from([...header, ...body]), output: Uint8Array.from(out) };
}

describe('snappyDecompress', () => {
  it('decodes a literal and an overlapping 1-byte-offset copy (format_description.txt §2.1, §2.2.1)', () => {
    // Length 12 (varint 0x0c); literal of 4 (tag (4-1)<<2 = 0x0c) "abcd"; copy length 8 offset 4 (tag (8-4)<<2 | 1 = 0x11, 0x04).
    expect(new TextDecoder().decode(decode([0x0c, 0x0c, 0x61, 0x62, 0x63, 0x64, 0x11, 0x04], 12))).toBe('abcdabcdabcd');
    // A run: literal "x", then copy length 64 offset 1 with a 2-byte offset (tag (64-1)<<2 | 2 = 0xfe).
    expect(decode([65, 0x00, 0x78, 0xfe, 0x01, 0x00], 65)).toEqual(new Uint8Array(65).fill(0x78));
  });

  it('gives the bytes of the stream and equals hyparquet 1.33.0 snappyUncompress on 300 random valid streams', () => {
    const random = seededRandom(31);
    for (let t = 0; t < 300; t++) {
      const { input, output } = randomStream(random);
      const ours = new Uint8Array(output.length);
      snappyDecompress(input, ours);
      const theirs = new Uint8Array(output.length);
      snappyUncompress(input, theirs);
      expect(Buffer.from(ours).equals(Buffer.from(output))).toBe(true);
      expect(Buffer.from(ours).equals(Buffer.from(theirs))).toBe(true);
    }
  });

  it('rejects a copy from before the start, a truncated literal and a length that does not match', () => {
    expect(() => decode([4, 0x00, 0x61, 0x11, 0x04], 4)).toThrow('copy offset 4 at output byte 1 is out of range');
    expect(() => decode([4, 0x0c, 0x61, 0x62], 4)).toThrow('literal runs past the input');
    expect(() => decode([5, 0x0c, 0x61, 0x62, 0x63, 0x64], 5)).toThrow('the data end after 4 of 5 bytes');
    expect(() => decode([4, 0x0c, 0x61, 0x62, 0x63, 0x64], 3)).toThrow('the data hold 4 bytes, 3 expected');
  });
});
