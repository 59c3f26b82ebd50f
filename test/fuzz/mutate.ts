// Seeded mutations of valid inputs: bytes flipped, set to edge values, numbers written over size
// fields, truncated, duplicated, and spliced with another seed of the same format. The same seed
// and index give the same mutant, so any finding is reproduced from its numbers alone.
import { seededRandom, type Random } from '../../src/core/random';

/** Little-endian 32-bit values that often break size and offset fields (common practice in fuzzing). */
const EDGE_U32 = [0, 1, 2, 0x7f, 0x80, 0xff, 0x100, 0x7fff, 0x8000, 0xffff, 0x10000, 0x7fffffff, 0x80000000, 0xfffffffe, 0xffffffff];
/** Text fragments that stress parsers of CSV, JSON and EDF header fields. */
const EDGE_TEXT = ['"', '""', ',', ';', '\t', '\n', '\r\n', '\r', '-', '+', '.', 'e', '1e309', '-1e309', 'NaN', '-0', '0x10', '99999999999999999999', '   ', '\u0000', '\u00ff', 'é', '{', '}', '[', ']', 'null', 'true', '-1', '2147483648', '1.5'];

export type Mutation = 'flip' | 'edge-byte' | 'edge-u32' | 'edge-text' | 'truncate' | 'duplicate' | 'splice' | 'delete';
const KINDS: Mutation[] = ['flip', 'edge-byte', 'edge-u32', 'edge-text', 'truncate', 'duplicate', 'splice', 'delete'];

const int = (random: Random, n: number) => Math.floor(random() * n);

function one(kind: Mutation, b: Uint8Array, others: readonly Uint8Array[], random: Random): Uint8Array {
  const n = b.length;
  switch (kind) {
    case 'flip': {
      const out = b.slice();
      for (let k = 1 + int(random, 8); k > 0 && n > 0; k--) out[int(random, n)] ^= 1 << int(random, 8);
      return out;
    }
    case 'edge-byte': {
      const out = b.slice();
      const values = [0, 0xff, 0x7f, 0x80, 0x20, 0x30, 0x39, 0x2d, int(random, 256)];
      for (let k = 1 + int(random, 4); k > 0 && n > 0; k--) out[int(random, n)] = values[int(random, values.length)];
      return out;
    }
    case 'edge-u32': {
      if (n < 4) return b;
      const out = b.slice();
      const at = int(random, n - 3);
      new DataView(out.buffer).setUint32(at, EDGE_U32[int(random, EDGE_U32.length)], random() < 0.5);
      return out;
    }
    case 'edge-text': {
      const bytes = new TextEncoder().encode(EDGE_TEXT[int(random, EDGE_TEXT.length)]);
      const at = int(random, n + 1);
      const overwrite = random() < 0.5;
      const out = new Uint8Array(overwrite ? Math.max(n, at + bytes.length) : n + bytes.length);
      out.set(b.subarray(0, at));
      out.set(bytes, at);
      out.set(b.subarray(overwrite ? Math.min(n, at + bytes.length) : at), at + bytes.length);
      return out;
    }
    case 'truncate':
      return b.slice(0, int(random, n + 1));
    case 'delete': {
      const at = int(random, n + 1);
      const len = int(random, Math.min(64, n - at) + 1);
      const out = new Uint8Array(n - len);
      out.set(b.subarray(0, at));
      out.set(b.subarray(at + len), at);
      return out;
    }
    case 'duplicate': {
      const from = int(random, n + 1);
      const len = int(random, Math.min(n - from, 256) + 1);
      const at = int(random, n + 1);
      const out = new Uint8Array(n + len);
      out.set(b.subarray(0, at));
      out.set(b.subarray(from, from + len), at);
      out.set(b.subarray(at), at + len);
      return out;
    }
    case 'splice': {
      const other = others[int(random, others.length)];
      const cut = int(random, n + 1);
      const from = int(random, other.length + 1);
      const out = new Uint8Array(cut + other.length - from);
      out.set(b.subarray(0, cut));
      out.set(other.subarray(from), cut);
      return out;
    }
  }
}

/**
 * Mutant number `index` of a campaign: one of the seeds, changed by one to three mutations.
 * Returns the bytes and the mutations applied (for the report of a finding).
 */
export function mutant(seeds: readonly Uint8Array[], campaignSeed: number, index: number): { bytes: Uint8Array; seed: number; applied: Mutation[] } {
  const random = seededRandom((campaignSeed * 1_000_003 + index) >>> 0);
  const seed = int(random, seeds.length);
  let bytes = seeds[seed];
  const applied: Mutation[] = [];
  for (let k = 1 + int(random, 3); k > 0; k--) {
    const kind = KINDS[int(random, KINDS.length)];
    bytes = one(kind, bytes, seeds, random);
    applied.push(kind);
  }
  return { bytes, seed, applied };
}
