import type { RecipeStepRecord } from '../analysis.types';
import { OptionError } from '../errors';
import { clipInPlace } from './clip';
import { missingPerColumn } from './column-stats';
import { featuresToKeep, windowsToKeep } from './drop-missing';
import { fillMissingInPlace } from './fill';
import { imputeInPlace } from './impute';
import { logInPlace } from './log-transform';
import { minMaxInPlace } from './minmax';
import { nearConstantFeatures, pruneCorrelated } from './prune';
import type { RecipeStep } from './recipe.types';
import { robustScaleInPlace } from './robust';
import { keepFeatures, keepWindows, type RecipeState } from './state';
import { subjectZScoreStep } from './subject-zscore-step';
import { zscoreInPlace } from './zscore';

/** Fewest windows and features a recipe may leave (an analysis needs 2 windows and 1 feature). */
const MIN_WINDOWS = 2;

export interface StepOutcome {
  state: RecipeState;
  record: RecipeStepRecord;
}

/**
 * Applies one validated step. `state.data` is modified in place or replaced (steps that drop
 * windows or features build new arrays); the caller passes a state it may give away.
 */
export function runStep(state: RecipeState, step: RecipeStep, index: number): StepOutcome {
  const { data, n, d, featureNames } = state;
  const names = (idx: number[]) => idx.map((j) => featureNames[j]);
  const where = `recipe step ${index + 1} (${step.type})`;
  const needSubjects = (): Int32Array => {
    if (!state.subjects) throw new OptionError(`${where} scope`, 'subject', 'a study with a subject column (none is set)');
    return state.subjects;
  };
  const record = (params: Record<string, unknown>, effect: Record<string, unknown>): RecipeStepRecord => ({ step: step.type, params, effect });

  switch (step.type) {
    case 'zscore': {
      let missingValues = 0;
      for (let i = 0; i < data.length; i++) if (data[i] !== data[i]) missingValues++;
      const z = zscoreInPlace(data, n, d);
      return {
        state: { ...state, centred: true },
        record: record({ ddof: 0, missing: 'omit', constant: 'set to 0' }, { features: d, constantFeatures: names(z.constantFeatures), missingValues }),
      };
    }
    case 'subject-zscore':
      return subjectZScoreStep(state, needSubjects(), record);
    case 'impute': {
      if (step.method === 'mean' && step.scope === 'global' && state.centred) {
        // Every feature's mean is exactly 0 after a z-score: fill with 0 rather than a rounded mean.
        const filled = fillMissingInPlace(data, 0);
        return { state, record: record({ method: 'mean', value: 0, space: 'scaled' }, { filled }) };
      }
      const subjects = step.scope === 'subject' ? needSubjects() : undefined;
      const e = imputeInPlace(data, n, d, { method: step.method, subjects });
      const effect: Record<string, unknown> = { filled: e.filled };
      if (subjects) effect.filledFromAllSubjects = e.filledGlobally;
      return { state: { ...state, centred: state.centred && step.method === 'mean' && !subjects }, record: record({ method: step.method, scope: step.scope }, effect) };
    }
    case 'robust': {
      const e = robustScaleInPlace(data, n, d, step.quantileRange);
      return { state: { ...state, centred: false }, record: record({ quantileRange: step.quantileRange, zeroSpread: 'scale 1' }, { features: d, zeroSpreadFeatures: names(e.zeroSpreadFeatures) }) };
    }
    case 'minmax': {
      const e = minMaxInPlace(data, n, d);
      return { state: { ...state, centred: false }, record: record({ range: [0, 1], constant: 'set to 0' }, { features: d, constantFeatures: names(e.constantFeatures) }) };
    }
    case 'log': {
      const columns = step.features.length === 0 ? featureNames.map((_, j) => j) : step.features.map((f) => {
        const j = featureNames.indexOf(f);
        if (j < 0) throw new OptionError(`${where} features`, f, `names of features present at this step (${shortList(featureNames)})`);
        return j;
      });
      const e = logInPlace(data, n, d, columns, step.mode);
      return { state: { ...state, centred: false }, record: record({ mode: step.mode, features: names(columns) }, { transformed: e.transformed, madeMissing: e.madeMissing }) };
    }
    case 'clip': {
      const e = clipInPlace(data, n, d, step.lower, step.upper);
      return { state: { ...state, centred: false }, record: record({ lower: step.lower, upper: step.upper, percentiles: 'linear' }, { clippedLow: e.clippedLow, clippedHigh: e.clippedHigh }) };
    }
    case 'drop-missing': {
      if (step.axis === 'features') {
        const keep = featuresToKeep(data, n, d, step.threshold);
        if (keep.length === 0) throw new OptionError(`${where} threshold`, step.threshold, 'a threshold that keeps at least 1 feature (it keeps none)');
        const missing = missingPerColumn(data, n, d);
        const dropped = featureNames.flatMap((f, j) => (keep.includes(j) ? [] : [{ feature: f, missingShare: missing[j] / n }]));
        return { state: keepFeatures(state, keep), record: record({ axis: 'features', threshold: step.threshold }, { dropped }) };
      }
      const keep = windowsToKeep(data, n, d, step.threshold);
      if (keep.length < MIN_WINDOWS) {
        throw new OptionError(`${where} threshold`, step.threshold, `a threshold that keeps at least ${MIN_WINDOWS} windows (it keeps ${keep.length} of ${n})`);
      }
      return { state: keepWindows(state, keep), record: record({ axis: 'windows', threshold: step.threshold }, { dropped: n - keep.length, kept: keep.length }) };
    }
    case 'prune-constant': {
      const found = nearConstantFeatures(data, n, d, step.minVariance, step.maxModeShare);
      if (found.length === d) throw new OptionError(`${where} maxModeShare`, step.maxModeShare, 'settings that keep at least 1 feature (every feature is near-constant)');
      const gone = new Set(found.map((f) => f.index));
      const keep = featureNames.map((_, j) => j).filter((j) => !gone.has(j));
      const dropped = found.map((f) => ({ feature: featureNames[f.index], variance: f.variance, modeShare: f.modeShare }));
      return { state: keepFeatures(state, keep), record: record({ minVariance: step.minVariance, maxModeShare: step.maxModeShare }, { dropped }) };
    }
    case 'prune-correlated': {
      const found = pruneCorrelated(data, n, d, step.threshold);
      const gone = new Set(found.map((f) => f.index));
      const keep = featureNames.map((_, j) => j).filter((j) => !gone.has(j));
      const dropped = found.map((f) => ({ feature: featureNames[f.index], keptInstead: featureNames[f.because], r: f.r }));
      return { state: keepFeatures(state, keep), record: record({ threshold: step.threshold, keep: 'earlier feature' }, { dropped }) };
    }
  }
}

function shortList(names: string[]): string {
  return names.length <= 5 ? names.join(', ') : `${names.slice(0, 5).join(', ')}, ...`;
}
