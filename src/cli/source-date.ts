import { UsageError } from './usage-error';

/**
 * The time written into outputs that record when they were made (a study's run `createdAt`):
 * SOURCE_DATE_EPOCH (whole seconds since 1970-01-01 UTC, the reproducible-builds convention) when
 * set, so that the same command gives the same bytes; else the wall clock. A malformed value is
 * refused rather than ignored, as that convention asks.
 */
export function outputTime(env: NodeJS.ProcessEnv = process.env, now: () => Date = () => new Date()): string {
  const raw = env.SOURCE_DATE_EPOCH;
  if (raw === undefined || raw === '') return now().toISOString();
  if (!/^\d{1,12}$/.test(raw)) {
    throw new UsageError(`SOURCE_DATE_EPOCH must be a whole number of seconds since 1970-01-01 UTC, found "${raw}"`);
  }
  const ms = Number(raw) * 1000;
  // ECMAScript dates end at 8.64e15 ms (year 275760).
  if (ms > 8.64e15) throw new UsageError(`SOURCE_DATE_EPOCH must be at most 8640000000000 seconds, found "${raw}"`);
  return new Date(ms).toISOString();
}
