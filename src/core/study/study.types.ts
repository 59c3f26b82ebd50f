import type { AnalysisResult } from '../analysis.types';
import type { CurationAction } from '../curation/curation.types';
import type { Roles } from '../table/roles.types';

/** The schema version this code writes; older files are migrated on opening (migrate.ts). */
export const STUDY_SCHEMA_VERSION = 1;

/** One input file of the study, identified by its hash so a changed file is noticed. */
export interface StudyInput {
  /** File name without folders, for messages. */
  fileName: string;
  /** Path as the user opened it (absolute, or relative to the study file's folder). */
  path: string;
  /** Hex SHA-256 of the file's bytes. */
  sha256: string;
  rows: number;
}

/** A flag the user or a check put on a cluster (e.g. "subject-bound", "review"). */
export interface ClusterFlag {
  cluster: number;
  flag: string;
  note?: string;
}

export interface StudyRun {
  /** Stable id, letters, digits, '-' and '_' only (it names the run's folder in the archive). */
  id: string;
  /** Index into Study.inputs. */
  input: number;
  roles: Roles;
  /** The analysis parameters as given (JSON; the recipe inside). */
  params: Record<string, unknown>;
  /** The run's result, typed arrays included (stored as binary entries). */
  result: AnalysisResult;
  /** Every curation change, in order (replayed from result.labels), and the actions undone since. */
  curation: { actions: CurationAction[]; undone: CurationAction[] };
  flags: ClusterFlag[];
  /** ISO 8601 time the run finished, from the caller's clock. */
  createdAt: string;
}

/** The saved workspace: inputs, runs with their results and curation, notes and view settings. */
export interface Study {
  schemaVersion: typeof STUDY_SCHEMA_VERSION;
  app: { name: string; version: string };
  inputs: StudyInput[];
  runs: StudyRun[];
  /** Index of the run shown when the study opens (-1 = none). */
  activeRun: number;
  notes: string;
  /** View settings (open views, colouring, map transform...), kept as the renderer gave them. */
  view: Record<string, unknown>;
}
