import { clipInPlace } from '../recipe/clip';
import { windowsToKeep } from '../recipe/drop-missing';
import { columnStatistics, fillColumnsInPlace } from '../recipe/impute';
import { logInPlace } from '../recipe/log-transform';
import { minMaxInPlace } from '../recipe/minmax';
import type { Recipe } from '../recipe/recipe.types';
import { robustScaleInPlace } from '../recipe/robust';
import { runStep } from '../recipe/run-step';
import { keepFeatures, keepWindows, type RecipeState } from '../recipe/state';
import { subjectGroups } from '../recipe/subject-groups';
import { subjectZscore } from '../recipe/subject-zscore';
import { zscoreInPlace } from '../recipe/zscore';

/**
 * A recipe frozen on the study's data: every statistic a step learned there (means, deviations,
 * medians, quantiles, the features it kept) is kept, so the same step can be applied to windows the
 * study never saw, one window at a time. Per-subject steps learn nothing to freeze: they use the
 * windows of each subject in the data they are applied to (see `PER_SUBJECT_MIN_WINDOWS`).
 */
export type FrozenStep =
  | { type: 'zscore'; means: number[]; scales: number[] }
  | { type: 'subject-zscore' }
  | { type: 'fill'; values: number[] }
  | { type: 'subject-impute'; method: 'mean' | 'median'; global: number[] }
  | { type: 'robust'; centres: number[]; scales: number[] }
  | { type: 'minmax'; mins: number[]; inverses: number[] }
  | { type: 'log'; mode: 'log1p' | 'signed-log'; columns: number[] }
  | { type: 'clip'; lows: number[]; highs: number[] }
  | { type: 'drop-windows'; threshold: number }
  | { type: 'keep-features'; keep: number[] };

export interface FrozenRecipe {
  /** Feature columns the recipe reads, in matrix order (the study's feature roles). */
  inputFeatures: string[];
  /** Features left after the recipe (the space clusters are assigned in). */
  outputFeatures: string[];
  steps: FrozenStep[];
}

/**
 * Fewest windows a subject must have in the data a per-subject step is applied to: a z-score
 * within a subject needs two windows to have a spread. (Per-subject imputation works from one.)
 */
export const PER_SUBJECT_MIN_WINDOWS: Readonly<Record<'subject-zscore' | 'subject-impute', number>> = {
  'subject-zscore': 2,
  'subject-impute': 1,
};

export interface FittedRecipe {
  frozen: FrozenRecipe;
  /** The recipe's output on the study's own data, exactly as `applyRecipe` computes it. */
  state: RecipeState;
}

const list = (a: ArrayLike<number>): number[] => Array.from(a);

/**
 * Runs a validated recipe on the study's matrix (through the recipe's own `runStep`, so the output
 * is the analysis's) and freezes, before each step, the statistics that step takes from the data.
 */
export function fitRecipe(data: Float64Array, n: number, featureNames: string[], subjects: Int32Array | undefined, recipe: Recipe): FittedRecipe {
  const d0 = featureNames.length;
  let state: RecipeState = {
    data: Float64Array.from(data), n, d: d0, featureNames: [...featureNames],
    windows: Int32Array.from({ length: n }, (_, i) => i),
    subjects: subjects ? Int32Array.from(subjects) : undefined,
    centred: false,
  };
  const steps: FrozenStep[] = [];
  recipe.steps.forEach((step, index) => {
    const { n: m, d } = state;
    const copy = () => Float64Array.from(state.data);
    let frozen: FrozenStep | undefined;
    switch (step.type) {
      case 'zscore': {
        const z = zscoreInPlace(copy(), m, d);
        // The kernel's rule: a spread at rounding level relative to the mean counts as constant.
        const scales = list(z.stds).map((sd, j) => (sd > 1e-12 * Math.max(1, Math.abs(z.means[j])) ? 1 / sd : 0));
        frozen = { type: 'zscore', means: list(z.means), scales };
        break;
      }
      case 'subject-zscore':
        frozen = { type: 'subject-zscore' };
        break;
      case 'impute':
        if (step.scope === 'subject') frozen = { type: 'subject-impute', method: step.method, global: list(columnStatistics(state.data, m, d, step.method)) };
        else if (step.method === 'mean' && state.centred) frozen = { type: 'fill', values: new Array<number>(d).fill(0) };
        else frozen = { type: 'fill', values: list(columnStatistics(state.data, m, d, step.method)) };
        break;
      case 'robust': {
        const r = robustScaleInPlace(copy(), m, d, step.quantileRange);
        frozen = { type: 'robust', centres: list(r.centres), scales: list(r.scales) };
        break;
      }
      case 'minmax': {
        const e = minMaxInPlace(copy(), m, d);
        frozen = { type: 'minmax', mins: list(e.mins), inverses: list(e.maxs).map((hi, j) => (hi > e.mins[j] ? 1 / (hi - e.mins[j]) : 0)) };
        break;
      }
      case 'clip': {
        const c = clipInPlace(copy(), m, d, step.lower, step.upper);
        frozen = { type: 'clip', lows: list(c.lows), highs: list(c.highs) };
        break;
      }
      case 'log':
      case 'drop-missing':
      case 'prune-constant':
      case 'prune-correlated':
        break; // frozen from what the step did (below)
    }
    const before = state.featureNames;
    state = runStep(state, step, index).state;
    if (step.type === 'log') {
      const columns = step.features.length === 0 ? before.map((_, j) => j) : step.features.map((f) => before.indexOf(f));
      frozen = { type: 'log', mode: step.mode, columns };
    } else if (step.type === 'drop-missing' && step.axis === 'windows') {
      frozen = { type: 'drop-windows', threshold: step.threshold };
    } else if (!frozen) {
      const at = new Map(before.map((f, j) => [f, j]));
      frozen = { type: 'keep-features', keep: state.featureNames.map((f) => at.get(f)!) };
    }
    steps.push(frozen);
  });
  return { frozen: { inputFeatures: [...featureNames], outputFeatures: [...state.featureNames], steps }, state };
}

export interface FrozenOutput {
  data: Float64Array;
  n: number;
  d: number;
  /** Input row of each output row (windows a drop step removed are left out). */
  windows: Int32Array;
}

/** Thrown when a per-subject step meets a subject with fewer windows than it needs. */
export class SplitSubjectError extends Error {
  constructor(readonly step: number, readonly stepType: string, readonly subject: number, readonly windows: number, readonly needed: number) {
    super(`recipe step ${step} (${stepType}) needs at least ${needed} windows of each subject, subject code ${subject} has ${windows}`);
    this.name = 'SplitSubjectError';
  }
}

/**
 * Applies a frozen recipe to a matrix whose columns are `frozen.inputFeatures` (the input is not
 * modified). Every step but the per-subject ones works window by window with the study's
 * statistics, so a window's output depends only on the window and, for per-subject steps, on the
 * other windows of its subject in this matrix.
 */
export function applyFrozen(frozen: FrozenRecipe, data: Float64Array, n: number, subjects: Int32Array | undefined): FrozenOutput {
  let state: RecipeState = {
    data: Float64Array.from(data), n, d: frozen.inputFeatures.length, featureNames: frozen.inputFeatures,
    windows: Int32Array.from({ length: n }, (_, i) => i),
    subjects: subjects ? Int32Array.from(subjects) : undefined,
    centred: false,
  };
  frozen.steps.forEach((step, index) => {
    const { data: x, n: m, d } = state;
    const each = (f: (v: number, j: number) => number) => {
      for (let i = 0; i < m; i++) {
        const o = i * d;
        for (let j = 0; j < d; j++) x[o + j] = f(x[o + j], j);
      }
    };
    switch (step.type) {
      case 'zscore':
        each((v, j) => (v === v ? (step.scales[j] === 0 ? 0 : (v - step.means[j]) * step.scales[j]) : v));
        break;
      case 'subject-zscore':
        checkSubjects(state.subjects, index, step.type);
        state = { ...state, data: subjectZscore(x, m, d, state.subjects!).data };
        break;
      case 'fill':
        fillColumnsInPlace(x, m, d, Float64Array.from(step.values));
        break;
      case 'subject-impute': {
        checkSubjects(state.subjects, index, step.type);
        // As the recipe's imputation: each subject's own statistic (taken before any value is
        // filled), else the global one, which here is the study's.
        const subjectsNow = state.subjects!;
        const own = subjectGroups(subjectsNow).map((rows) => columnStatistics(x, m, d, step.method, rows));
        for (let i = 0; i < m; i++) {
          const sub = subjectsNow[i];
          for (let j = 0; j < d; j++) {
            const o = i * d + j;
            if (x[o] === x[o]) continue;
            const v = sub >= 0 ? own[sub][j] : NaN;
            x[o] = v === v ? v : step.global[j];
          }
        }
        break;
      }
      case 'robust':
        each((v, j) => (v === v ? (v - step.centres[j]) / step.scales[j] : v));
        break;
      case 'minmax':
        each((v, j) => (v === v ? (step.inverses[j] === 0 ? 0 : Math.min(1, (v - step.mins[j]) * step.inverses[j])) : v));
        break;
      case 'log':
        logInPlace(x, m, d, step.columns, step.mode);
        break;
      case 'clip':
        each((v, j) => (v < step.lows[j] ? step.lows[j] : v > step.highs[j] ? step.highs[j] : v));
        break;
      case 'drop-windows':
        state = keepWindows(state, windowsToKeep(x, m, d, step.threshold));
        break;
      case 'keep-features':
        state = keepFeatures(state, step.keep);
        break;
    }
  });
  return { data: state.data, n: state.n, d: state.d, windows: state.windows };
}

function checkSubjects(subjects: Int32Array | undefined, index: number, type: 'subject-zscore' | 'subject-impute'): void {
  if (!subjects) throw new Error(`recipe step ${index + 1} (${type}) needs the subject of every window`);
  const counts = new Map<number, number>();
  for (const s of subjects) counts.set(s, (counts.get(s) ?? 0) + 1);
  const needed = PER_SUBJECT_MIN_WINDOWS[type];
  for (const [s, c] of [...counts].sort((a, b) => a[0] - b[0])) {
    if (c < needed) throw new SplitSubjectError(index + 1, type, s, c, needed);
  }
}
