import { OptionError } from '../errors';
import type { ClusterMix, CohortMix } from './cluster-mix';

/**
 * When a cluster counts as bound to a few values of a column (subject-bound for the subject
 * column; device-, site- or group-bound for others). A cluster is flagged when it holds at least
 * `minWindows` windows and its effective number of values (exp of the entropy of its value
 * shares) is at most `maxEffectiveShare` of the cohort's effective number of values. Judging
 * against the cohort's effective number (not the raw count) keeps the rule fair to cohorts with a
 * few dominant subjects.
 */
export interface BoundRule {
  /** Largest (cluster effective values) / (cohort effective values) that is flagged, in (0, 1). */
  maxEffectiveShare: number;
  /** Clusters smaller than this are not judged (too few windows to tell). */
  minWindows: number;
}

export const DEFAULT_BOUND_RULE: Readonly<BoundRule> = { maxEffectiveShare: 0.35, minWindows: 20 };

/** Share of a cluster's windows that the named dominant values cover, for the reason text. */
const DOMINANT_COVER = 0.9;
/** Most dominant values named in a reason. */
const MAX_NAMED = 3;

/** Merges a partial rule with the defaults and checks it; throws OptionError. */
export function boundRule(rule: Partial<BoundRule> = {}): BoundRule {
  const r = { ...DEFAULT_BOUND_RULE, ...rule };
  if (typeof r.maxEffectiveShare !== 'number' || !(r.maxEffectiveShare > 0 && r.maxEffectiveShare < 1)) {
    throw new OptionError('maxEffectiveShare', r.maxEffectiveShare, 'a number between 0 and 1');
  }
  if (!Number.isInteger(r.minWindows) || r.minWindows < 1) {
    throw new OptionError('minWindows', r.minWindows, 'an integer of at least 1');
  }
  return r;
}

export interface BoundVerdict {
  bound: boolean;
  /** Why, in one sentence with the numbers the rule used. */
  reason: string;
  /** Cluster effective values / cohort effective values (NaN when not judged). */
  effectiveShare: number;
}

const pct = (x: number) => `${Math.round(x * 100)}%`;
const fixed = (x: number) => x.toFixed(1);

/** Applies the rule to one cluster. `noun` names the column's values in the reason ("subject"). */
export function judgeBound(mix: ClusterMix, cohort: CohortMix, rule: BoundRule, noun = 'subject'): BoundVerdict {
  const plural = `${noun}s`;
  if (mix.size < rule.minWindows) {
    return { bound: false, effectiveShare: NaN, reason: `not judged: ${mix.size} windows, fewer than the ${rule.minWindows} the rule needs` };
  }
  if (cohort.values < 2) {
    return { bound: false, effectiveShare: NaN, reason: `not judged: the table holds ${cohort.values} ${cohort.values === 1 ? noun : plural}` };
  }
  const share = mix.effectiveValues / cohort.effectiveValues;
  const against = `${fixed(mix.effectiveValues)} effective ${plural} against ${fixed(cohort.effectiveValues)} in the cohort`;
  if (share > rule.maxEffectiveShare) {
    return { bound: false, effectiveShare: share, reason: `${against} (${pct(share)} > ${pct(rule.maxEffectiveShare)})` };
  }
  let covered = 0;
  const named: string[] = [];
  for (const e of mix.byValue) {
    if (covered / mix.size >= DOMINANT_COVER || named.length >= MAX_NAMED) break;
    named.push(e.value === '' ? '(missing)' : e.value);
    covered += e.windows;
  }
  const who = named.length === 1 ? `${noun} ${named[0]} holds` : `${plural} ${named.join(', ')} hold`;
  return {
    bound: true,
    effectiveShare: share,
    reason: `${against} (${pct(share)} ≤ ${pct(rule.maxEffectiveShare)}); ${who} ${pct(covered / mix.size)} of its ${mix.size} windows`,
  };
}
