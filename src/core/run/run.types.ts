import type { AnalysisParams, AnalysisResult } from '../analysis.types';
import type { Roles } from '../table/roles.types';

/** Where a windows table came from, for provenance. */
export interface Source {
  fileName: string;
  sha256: string;
  bytes: number;
}

/** The result of one run together with what it was run on (the app keeps these; a study stores them). */
export interface Run {
  result: AnalysisResult;
  params: AnalysisParams;
  /** Roles as they were when the run started (the export records these). */
  roles: Roles;
  featureNames: string[];
}
