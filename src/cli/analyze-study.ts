import { relative } from 'node:path';
import type { AnalysisParams, AnalysisResult } from '../core/analysis.types';
import { STUDY_SCHEMA_VERSION, type Study } from '../core/study/study.types';
import type { Roles } from '../core/table/roles.types';

export interface AnalyzeStudyArgs {
  /** The input as given on the command line, and the folder the study is written to. */
  inputPath: string;
  outDir: string;
  fileName: string;
  sha256: string;
  /** Rows of the input table (before the recipe dropped any window). */
  rows: number;
  /** Column roles the feature matrix was built with (before any window was dropped). */
  roles: Roles;
  params: AnalysisParams;
  result: AnalysisResult;
  createdAt: string;
  version: string;
}

/**
 * The study `gleaner analyze` leaves beside its outputs: one run (`run-1`, no curation yet), as
 * the app saves it, so it opens in the app and `gleaner run` and `gleaner apply` take it. The input
 * path is kept relative to the study's folder (how `gleaner run` looks for it), so the folder and
 * its input can move together.
 */
export function analyzeStudy(a: AnalyzeStudyArgs): Study {
  const path = relative(a.outDir, a.inputPath).split('\\').join('/');
  return {
    schemaVersion: STUDY_SCHEMA_VERSION,
    app: { name: 'Gleaner', version: a.version },
    inputs: [{ fileName: a.fileName, path, sha256: a.sha256, rows: a.rows }],
    runs: [{
      id: 'run-1',
      input: 0,
      roles: a.roles,
      params: { ...a.params } as unknown as Record<string, unknown>,
      result: a.result,
      curation: { actions: [], undone: [] },
      flags: [],
      createdAt: a.createdAt,
    }],
    activeRun: 0,
    notes: '',
    view: {},
  };
}
