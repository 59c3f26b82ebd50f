/** A function returning uniform numbers in [0, 1), like Math.random but seeded. */
export type Random = () => number;

/**
 * Seeded generator (SplitMix32 state advance + a Mulberry32-style output mix; common practice for
 * small, fast, reproducible streams). Same seed, same sequence, on every platform.
 */
export function seededRandom(seed: number): Random {
  let state = (Math.floor(seed) >>> 0) ^ 0x9e3779b9;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviate by the Box–Muller transform. */
export function normal(random: Random): number {
  let u = 0;
  while (u === 0) u = random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/** Integer in [0, n). */
export function randomInt(random: Random, n: number): number {
  return Math.floor(random() * n);
}
