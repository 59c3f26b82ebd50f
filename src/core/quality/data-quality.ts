import type { FeatureMatrix } from '../analysis.types';
import { correlatedPairs, nearConstantFeatures } from '../recipe/prune';
import { extremeCount } from './extremes';
import { missingness } from './missingness';
import { DEFAULT_QUALITY_OPTIONS, type DataQuality, type QualityOptions } from './quality.types';

const pct = (x: number) => `${(100 * x).toFixed(x < 0.01 ? 2 : 0)}%`;

/**
 * The data-quality report of a feature matrix: missingness per feature and per subject × feature,
 * near-constant features, highly correlated pairs and features with extreme values, each issue
 * with the recipe step that fixes it. Correlation costs n·d²/2: meant for d up to a few hundred.
 */
export function dataQuality(matrix: FeatureMatrix, subjectCodes?: Int32Array, subjectNames?: string[], options: Partial<QualityOptions> = {}): DataQuality {
  const o = { ...DEFAULT_QUALITY_OPTIONS, ...options };
  const { data, n, d, featureNames } = matrix;
  if (subjectCodes && subjectCodes.length !== n) throw new Error(`expected ${n} subject codes (one per window), got ${subjectCodes.length}`);

  const m = missingness(data, n, d, subjectCodes, subjectNames);
  const missingIssues = featureNames.flatMap((feature, j) => {
    const share = m.perFeature[j];
    if (share === 0) return [];
    const drop = share > o.dropFeatureAbove;
    return [{
      feature,
      share,
      message: `"${feature}" is missing in ${pct(share)} of windows`,
      fix: drop
        ? { type: 'drop-missing' as const, axis: 'features' as const, threshold: o.dropFeatureAbove }
        : { type: 'impute' as const, method: 'median' as const, scope: subjectCodes ? ('subject' as const) : ('global' as const) },
    }];
  });

  const nearConstant = nearConstantFeatures(data, n, d, o.minVariance, o.maxModeShare).map((f) => ({
    feature: featureNames[f.index],
    variance: f.variance,
    modeShare: f.modeShare,
    message: f.modeShare >= o.maxModeShare
      ? `"${featureNames[f.index]}" has one value in ${pct(f.modeShare)} of its windows`
      : `"${featureNames[f.index]}" is constant`,
    fix: { type: 'prune-constant' as const, minVariance: o.minVariance, maxModeShare: o.maxModeShare },
  }));

  const correlated = correlatedPairs(data, n, d, o.correlation).slice(0, o.maxPairs).map((p) => ({
    a: featureNames[p.a],
    b: featureNames[p.b],
    r: p.r,
    message: `"${featureNames[p.a]}" and "${featureNames[p.b]}" correlate at r = ${p.r.toFixed(3)}`,
    fix: { type: 'prune-correlated' as const, threshold: o.correlation },
  }));

  const extremes = featureNames.flatMap((feature, j) => {
    const e = extremeCount(data, n, d, j, o.robustZ);
    if (e.count === 0) return [];
    const present = n - Math.round(m.perFeature[j] * n);
    const share = e.count / present;
    // A one-sided heavy tail on a non-negative feature is what a log transform is for; otherwise clip.
    const fix = e.nonNegative
      ? { type: 'log' as const, mode: 'log1p' as const, features: [feature] }
      : { type: 'clip' as const, lower: 1, upper: 99 };
    return [{ feature, count: e.count, share, maxRobustZ: e.maxRobustZ, message: `"${feature}" has ${e.count} window${e.count === 1 ? '' : 's'} beyond robust z ${o.robustZ} (largest ${e.maxRobustZ.toFixed(1)})`, fix }];
  });

  return { n, d, featureNames, missing: { ...m, issues: missingIssues }, nearConstant, correlated, extremes };
}
