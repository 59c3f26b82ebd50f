import type { Run } from '../../core/run/run.types';
import { recipeText } from '../lib/recipe-text';

/** One run kept in the study: its name, what it was run with and its result. */
export interface KeptRun {
  id: number;
  name: string;
  run: Run;
  /** Cluster names given while this run was shown (restored when it is shown again). */
  names: string[];
}

/** A name for a new run: "run 2 · k = 7 · per-subject z-score → impute (mean)". */
export function runName(id: number, run: Run): string {
  return `run ${id} · k = ${run.params.k} · ${recipeText(run.params.recipe)}`;
}
