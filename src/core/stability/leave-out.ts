import type { Random } from '../random';

/** How many of `subjects` subjects a share leaves out: rounded, and at least one subject is kept. */
export function subjectsToLeaveOut(subjects: number, share: number): number {
  return Math.min(subjects - 1, Math.max(0, Math.round(share * subjects)));
}

/**
 * `count` distinct subject codes of 0..subjects−1 drawn without replacement (partial Fisher–Yates
 * on the seeded stream), ascending. Draws exactly `count` numbers from `random`.
 */
export function drawLeftOut(subjects: number, count: number, random: Random): number[] {
  const pool = Array.from({ length: subjects }, (_, i) => i);
  for (let i = 0; i < count; i++) {
    const j = i + Math.floor(random() * (subjects - i));
    const t = pool[i];
    pool[i] = pool[j];
    pool[j] = t;
  }
  return pool.slice(0, count).sort((a, b) => a - b);
}
