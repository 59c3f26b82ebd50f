import { initialCuration } from '../curation/initial-state';
import { replay } from '../curation/history';
import type { CurationState } from '../curation/curation.types';
import type { StudyRun } from './study.types';

/** The run's curation now: its recorded actions replayed on the run's labels. */
export function runCuration(run: Pick<StudyRun, 'result' | 'curation'>, labels: Int32Array = run.result.labels): CurationState {
  return replay(initialCuration(labels, run.result.cluster.k, run.result.cluster), run.curation.actions);
}
