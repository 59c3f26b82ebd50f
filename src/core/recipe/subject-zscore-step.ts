import type { RecipeStepRecord } from '../analysis.types';
import type { RecipeState } from './state';
import { subjectZscore } from './subject-zscore';

type MakeRecord = (params: Record<string, unknown>, effect: Record<string, unknown>) => RecipeStepRecord;

/** The recipe's per-subject z-score step: a wrapper over the subjectZscore kernel. */
export function subjectZScoreStep(state: RecipeState, subjects: Int32Array, record: MakeRecord): { state: RecipeState; record: RecipeStepRecord } {
  const { data, n, d } = state;
  let missingValues = 0;
  for (let i = 0; i < data.length; i++) if (data[i] !== data[i]) missingValues++;
  const scaled = subjectZscore(data, n, d, subjects);
  return {
    // Each subject's mean of each feature is 0, so the overall mean is 0 too.
    state: { ...state, data: scaled.data, centred: true },
    record: record(
      { ddof: 0, missing: 'omit', within: 'subject', constant: 'set to 0', noSubject: 'one group' },
      { features: d, missingValues, ...scaled.effect },
    ),
  };
}
