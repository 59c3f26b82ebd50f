/**
 * Incremental SHA-256 (FIPS 180-4), so a file's hash is computed slice by slice as it streams in,
 * without holding the whole file. `createSha256().update(a).update(b).hex()` equals the hash of a+b.
 */

// Int32Array throughout: a Uint32Array read above 2^31 is a double to the JIT, which halved the speed.
const K = Int32Array.from([
  0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4, 0xab1c5ed5,
  0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3, 0x72be5d74, 0x80deb1fe, 0x9bdc06a7, 0xc19bf174,
  0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f, 0x4a7484aa, 0x5cb0a9dc, 0x76f988da,
  0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7, 0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967,
  0x27b70a85, 0x2e1b2138, 0x4d2c6dfc, 0x53380d13, 0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85,
  0xa2bfe8a1, 0xa81a664b, 0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070,
  0x19a4c116, 0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3,
  0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208, 0x90befffa, 0xa4506ceb, 0xbef9a3f7, 0xc67178f2,
].map((k) => k | 0));

export interface Sha256 {
  update(bytes: Uint8Array): Sha256;
  /** Finishes the hash: lowercase hex of the 32-byte digest. No update may follow. */
  hex(): string;
}

export function createSha256(): Sha256 {
  const h = Int32Array.from([0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a, 0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19], (x) => x | 0);
  const w = new Int32Array(64);
  const block = new Uint8Array(64);
  let filled = 0;
  let length = 0; // bytes so far (exact up to 2^53)
  let done = false;

  const compress = (b: Uint8Array, at: number) => compressBlock(h, w, b, at);

  const api: Sha256 = {
    update(bytes) {
      if (done) throw new Error('sha256: update after hex()');
      length += bytes.length;
      let i = 0;
      if (filled > 0) {
        const take = Math.min(64 - filled, bytes.length);
        block.set(bytes.subarray(0, take), filled);
        filled += take;
        i = take;
        if (filled < 64) return api;
        compress(block, 0);
        filled = 0;
      }
      for (; i + 64 <= bytes.length; i += 64) compress(bytes, i);
      if (i < bytes.length) {
        block.set(bytes.subarray(i), 0);
        filled = bytes.length - i;
      }
      return api;
    },
    hex() {
      if (done) throw new Error('sha256: hex() called twice');
      done = true;
      const bits = length * 8;
      block[filled++] = 0x80;
      if (filled > 56) {
        block.fill(0, filled);
        compress(block, 0);
        filled = 0;
      }
      block.fill(0, filled, 56);
      const hi = Math.floor(bits / 2 ** 32), lo = bits >>> 0;
      block[56] = hi >>> 24; block[57] = (hi >>> 16) & 255; block[58] = (hi >>> 8) & 255; block[59] = hi & 255;
      block[60] = lo >>> 24; block[61] = (lo >>> 16) & 255; block[62] = (lo >>> 8) & 255; block[63] = lo & 255;
      compress(block, 0);
      return Array.from(h, (x) => (x >>> 0).toString(16).padStart(8, '0')).join('');
    },
  };
  return api;
}

/** One 64-byte block of b at `at` into the state h (FIPS 180-4 §6.2.2), w the message schedule. */
function compressBlock(h: Int32Array, w: Int32Array, b: Uint8Array, at: number): void {
  for (let t = 0; t < 16; t++) {
    const o = at + 4 * t;
    w[t] = (b[o] << 24) | (b[o + 1] << 16) | (b[o + 2] << 8) | b[o + 3];
  }
  for (let t = 16; t < 64; t++) {
    const x = w[t - 15], y = w[t - 2];
    const s0 = ((x >>> 7) | (x << 25)) ^ ((x >>> 18) | (x << 14)) ^ (x >>> 3);
    const s1 = ((y >>> 17) | (y << 15)) ^ ((y >>> 19) | (y << 13)) ^ (y >>> 10);
    w[t] = (w[t - 16] + s0 + w[t - 7] + s1) | 0;
  }
  let a = h[0], bb = h[1], c = h[2], d = h[3], e = h[4], f = h[5], g = h[6], hh = h[7];
  for (let t = 0; t < 64; t++) {
    const S1 = ((e >>> 6) | (e << 26)) ^ ((e >>> 11) | (e << 21)) ^ ((e >>> 25) | (e << 7));
    const ch = (e & f) ^ (~e & g);
    const t1 = (hh + S1 + ch + K[t] + w[t]) | 0;
    const S0 = ((a >>> 2) | (a << 30)) ^ ((a >>> 13) | (a << 19)) ^ ((a >>> 22) | (a << 10));
    const maj = (a & bb) ^ (a & c) ^ (bb & c);
    const t2 = (S0 + maj) | 0;
    hh = g; g = f; f = e; e = (d + t1) | 0; d = c; c = bb; bb = a; a = (t1 + t2) | 0;
  }
  h[0] = (h[0] + a) | 0; h[1] = (h[1] + bb) | 0; h[2] = (h[2] + c) | 0; h[3] = (h[3] + d) | 0;
  h[4] = (h[4] + e) | 0; h[5] = (h[5] + f) | 0; h[6] = (h[6] + g) | 0; h[7] = (h[7] + hh) | 0;
}
