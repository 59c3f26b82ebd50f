import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams } from '../../core/analysis.types';
import { OptionError } from '../../core/errors';

/** Limits the UI accepts; the core validates again at its own edge. */
export const PARAM_LIMITS = {
  k: { min: 2, max: 50 },
  restarts: { min: 1, max: 1000 },
  seed: { min: 0, max: 2 ** 31 - 1 },
} as const;

/** The run parameters the user edits in the side panel (defaults shared with the CLI). */
export class RunParams {
  k = $state(DEFAULT_ANALYSIS_PARAMS.k);
  seed = $state(DEFAULT_ANALYSIS_PARAMS.seed);
  restarts = $state(DEFAULT_ANALYSIS_PARAMS.restarts);

  /** The full parameter set for a run; throws OptionError naming the bad field. */
  toParams(): AnalysisParams {
    check('k (clusters)', this.k, PARAM_LIMITS.k);
    check('seed', this.seed, PARAM_LIMITS.seed);
    check('restarts', this.restarts, PARAM_LIMITS.restarts);
    return { ...DEFAULT_ANALYSIS_PARAMS, k: this.k, seed: this.seed, restarts: this.restarts };
  }
}

function check(name: string, value: number, limits: { min: number; max: number }): void {
  if (!Number.isInteger(value) || value < limits.min || value > limits.max) {
    throw new OptionError(name, value, `a whole number from ${limits.min} to ${limits.max}`);
  }
}
