import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { hashingSource } from '../../../src/core/hash/hashing-source';
import { bytesSource, countingSource } from '../../../src/core/raw/byte-source';
import { seededRandom } from '../../../src/core/random';

const random = seededRandom(5);
const file = Uint8Array.from({ length: 300_000 }, () => Math.floor(random() * 256));
// The reference digest: Node's crypto (OpenSSL) SHA-256 of the whole file.
const expected = createHash('sha256').update(file).digest('hex');

async function digestOf(reads: [number, number][], maxGap?: number): Promise<{ hex: string; bytesRead: number }> {
  const counted = countingSource(bytesSource(file));
  const hash = createHash('sha256');
  const source = hashingSource(counted, hash, maxGap);
  for (const [o, n] of reads) expect(await source.read(o, n)).toEqual(file.subarray(o, o + n));
  await source.finish();
  return { hex: hash.digest('hex'), bytesRead: counted.bytesRead };
}

describe('hashingSource', () => {
  it('hashes a front-to-back reader (footer first, then groups with small gaps) in one pass', async () => {
    const r = await digestOf([[299_000, 1000], [4, 100_000], [100_010, 100_000], [200_010, 98_000]], 10_000);
    expect(r.hex).toBe(expected);
    // The footer is read twice (once early, once by finish); everything else once.
    expect(r.bytesRead).toBeLessThan(file.length + 5000);
  });

  it('hashes every byte exactly once whatever the read order (overlaps, jumps back, concurrent reads)', async () => {
    expect((await digestOf([[200_000, 50_000], [0, 10], [5, 100], [50, 20], [150_000, 10]], 1000)).hex).toBe(expected);
    expect((await digestOf([])).hex).toBe(expected);
    const hash = createHash('sha256');
    const source = hashingSource(bytesSource(file), hash);
    await Promise.all([source.read(0, 1000), source.read(1000, 1000), source.read(500, 3000)]);
    await source.finish();
    expect(hash.digest('hex')).toBe(expected);
  });
});
