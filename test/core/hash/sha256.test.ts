import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { createSha256 } from '../../../src/core/hash/sha256';
import { seededRandom } from '../../../src/core/random';

const enc = (s: string) => new TextEncoder().encode(s);

describe('createSha256', () => {
  it('matches the FIPS 180-2 appendix B examples', () => {
    // FIPS 180-2, Appendix B.1 ("abc") and B.2 (the 448-bit message).
    expect(createSha256().update(enc('abc')).hex()).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(createSha256().update(enc('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).hex())
      .toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
    // SHA-256 of the empty message (common practice: the well-known e3b0c442… value).
    expect(createSha256().hex()).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('gives Node crypto\'s hash for any split of the input into slices', () => {
    const random = seededRandom(7);
    for (const size of [55, 56, 63, 64, 65, 1000, 70_001]) {
      const bytes = Uint8Array.from({ length: size }, () => Math.floor(random() * 256));
      const expected = createHash('sha256').update(bytes).digest('hex'); // node:crypto, Node 20
      const h = createSha256();
      for (let at = 0; at < size;) {
        const step = 1 + Math.floor(random() * 200);
        h.update(bytes.subarray(at, Math.min(size, at + step)));
        at += step;
      }
      expect(h.hex(), `size ${size}`).toBe(expected);
    }
  });
});
