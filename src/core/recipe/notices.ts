import type { FeatureMatrix, RecipeStepRecord } from '../analysis.types';
import { grouped, type Notice } from '../table/notices';
import { missingPerColumn } from './column-stats';

/** Missing cells per feature of a matrix, by name (what recipeNotices follows through the steps). */
export function missingByFeature(matrix: Pick<FeatureMatrix, 'data' | 'n' | 'd' | 'featureNames'>): Map<string, number> {
  const missing = missingPerColumn(matrix.data, matrix.n, matrix.d);
  return new Map(matrix.featureNames.map((f, j) => [f, missing[j]]));
}

/** Steps that leave every missing value where it was (they scale, shift or clip present values). */
const KEEP_MISSING: ReadonlySet<string> = new Set(['zscore', 'subject-zscore', 'robust', 'minmax', 'clip']);

const names = (v: unknown): string[] => (Array.isArray(v) ? v.map((x) => (typeof x === 'string' ? x : String((x as { feature?: unknown }).feature))) : []);
const count = (v: unknown): number => (typeof v === 'number' ? v : 0);
const s = (n: number) => (n === 1 ? '' : 's');

/**
 * The automatic decisions a recipe made, told from its step records (what summary.json lists
 * under `recipe`): constant features set to 0, near-constant, correlated or mostly-missing
 * features dropped, windows dropped, and the cells each impute step filled, per feature. The
 * per-feature fill counts are the feature's missing cells in the matrix the recipe started from
 * (`missingByFeature`, taken before the matrix goes to the worker),
 * followed through the steps before the fill; they are given only when they add up to the
 * step's recorded total (else the total alone is told).
 */
export function recipeNotices(fileName: string, missing: ReadonlyMap<string, number>, records: readonly RecipeStepRecord[]): Notice[] {
  const out: Notice[] = [];
  // Missing cells per feature still present, while they can be followed; null once they cannot.
  let tracked: Map<string, number> | null = new Map(missing);
  const drop = (list: string[]) => { for (const f of list) tracked?.delete(f); };
  records.forEach((r, i) => {
    const e = r.effect;
    const step = `recipe step ${i + 1} (${r.step})`;
    const tell = (kind: Notice['kind'], message: string, column?: string, n?: number) => out.push({
      kind, ...(column !== undefined ? { column } : {}), ...(n !== undefined ? { count: n } : {}),
      message: column === undefined ? `${fileName}: ${message}` : `${fileName}, feature "${column}": ${message}`,
    });
    switch (r.step) {
      case 'zscore':
      case 'subject-zscore':
      case 'minmax':
        for (const f of names(e.constantFeatures)) tell('feature-constant', `constant; ${step} set it to 0 in every window`, f);
        break;
      case 'robust':
        for (const f of names(e.zeroSpreadFeatures)) tell('feature-constant', `no spread between the chosen percentiles; ${step} only centred it`, f);
        break;
      case 'prune-constant':
        for (const d of (e.dropped as { feature: string; variance: number; modeShare: number }[] | undefined) ?? []) {
          tell('feature-dropped', `near-constant (variance ${d.variance.toPrecision(3)}, ${Math.round(d.modeShare * 100)}% of windows at one value); ${step} dropped it`, d.feature);
        }
        drop(names(e.dropped));
        break;
      case 'prune-correlated':
        for (const d of (e.dropped as { feature: string; keptInstead: string; r: number }[] | undefined) ?? []) {
          tell('feature-dropped', `correlates with "${d.keptInstead}" (r = ${d.r.toFixed(3)}); ${step} dropped it`, d.feature);
        }
        drop(names(e.dropped));
        break;
      case 'drop-missing':
        if (Array.isArray(e.dropped)) {
          for (const d of e.dropped as { feature: string; missingShare: number }[]) {
            tell('feature-dropped', `${Math.round(d.missingShare * 100)}% missing; ${step} dropped it`, d.feature);
          }
          drop(names(e.dropped));
        } else if (count(e.dropped) > 0) {
          const n = count(e.dropped);
          tell('rows-dropped', `${step} dropped ${grouped(n)} window${s(n)} with missing values (${grouped(count(e.kept))} kept)`, undefined, n);
          tracked = null;
        }
        break;
      case 'log':
        if (count(e.madeMissing) > 0) {
          const n = count(e.madeMissing);
          tell('cells-made-missing', `${step} made ${grouped(n)} cell${s(n)} missing (the log of a value below its domain)`, undefined, n);
          tracked = null;
        }
        break;
      case 'impute': {
        const filled = count(e.filled);
        if (filled === 0) break;
        const how = r.params.value === 0 ? 'the feature mean (0 after scaling)' : `the ${String(r.params.scope) === 'subject' ? "subject's" : "feature's"} ${String(r.params.method)}`;
        const per = tracked ? [...tracked].filter(([, n]) => n > 0) : [];
        if (tracked && per.reduce((a, [, n]) => a + n, 0) === filled) {
          for (const [f, n] of per) tell('cells-filled', `${grouped(n)} missing cell${s(n)} filled with ${how} by ${step}`, f, n);
        } else {
          tell('cells-filled', `${grouped(filled)} missing cell${s(filled)} filled with ${how} by ${step}`, undefined, filled);
        }
        if (count(e.filledFromAllSubjects) > 0) {
          const n = count(e.filledFromAllSubjects);
          tell('cells-filled', `${grouped(n)} of the cells ${step} filled took all subjects' values, their subject having none`, undefined, n);
        }
        if (tracked) for (const f of tracked.keys()) tracked.set(f, 0);
        break;
      }
      default:
        if (!KEEP_MISSING.has(r.step)) tracked = null;
    }
    if (r.step === 'subject-zscore' && count(e.windowsWithoutSubject) > 0) {
      const n = count(e.windowsWithoutSubject);
      tell('windows-without-subject', `${grouped(n)} window${s(n)} without a subject scaled as one group of their own by ${step}`, undefined, n);
    }
  });
  return out;
}
