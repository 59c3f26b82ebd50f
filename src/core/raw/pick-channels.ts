import { OptionError } from '../errors';
import type { RawChannelInfo } from './span.types';

/** Indices into `channels` of the chosen labels or indices (all when none are given). */
export function pickChannels(channels: readonly RawChannelInfo[], chosen: readonly (string | number)[] | undefined): number[] {
  if (chosen === undefined) return channels.map((_, i) => i);
  return chosen.map((c) => {
    const i = typeof c === 'number' ? c : channels.findIndex((ch) => ch.label === c);
    if (!Number.isInteger(i) || i < 0 || i >= channels.length) {
      throw new OptionError('channel', c, `one of ${channels.map((ch) => JSON.stringify(ch.label)).join(', ')} or an index below ${channels.length}`);
    }
    return i;
  });
}

/** Number of grid samples at `rate` from t0 up to (not including) end. */
export function gridLength(t0: number, end: number, rate: number): number {
  return Math.max(0, Math.ceil((end - t0) * rate - 1e-6));
}
