import type { CurationAction } from '../curation/curation.types';
import { keepRows } from '../recipe/keep-rows';
import type { Study } from '../study/study.types';
import { runCuration } from '../study/run-curation';
import type { AnalysisParams } from '../analysis.types';
import type { Table } from '../table/table';
import { edfAnnotationFiles } from './edf-annotations';
import { eventsTsv } from './events-tsv';
import { labelFirstCsv, labelFirstList } from './label-first';
import { buildProvenance } from './provenance';
import { eventSegments, type SegmentOptions } from './segments';
import { clusterIdentities, clusterNumber } from './run-model';
import { weakLabelsCsv } from './weak-labels';

export interface StudyExportFile {
  name: string;
  data: string | Uint8Array;
}

/** "windows.csv" → "windows". */
function baseName(fileName: string): string {
  const dot = fileName.lastIndexOf('.');
  return dot > 0 ? fileName.slice(0, dot) : fileName;
}

/** Action fields that name a cluster index; provenance writes them as cluster numbers. */
const CLUSTER_FIELDS = new Set(['cluster', 'into', 'from', 'to']);

/** An action as provenance text: clusters by number (index + 1), typed arrays as their length. */
function actionRecord(a: CurationAction): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(a)) {
    if (v instanceof Int32Array) out[k] = { windows: v.length };
    else if (CLUSTER_FIELDS.has(k)) out[k] = Array.isArray(v) ? v.map((c: number) => clusterNumber(c)) : clusterNumber(v as number);
    else out[k] = v;
  }
  return out;
}

/**
 * The weak-label exports of one run of a study, with its curation applied: per-window CSV,
 * provenance JSON, "label these first" CSV and, with `events`, events.tsv and one EDF+ annotation
 * file per subject (and session). The app and `gleaner run` both write these, so the same study
 * gives the same bytes (provenance differs only in `createdAt`). `table` is the run's input table
 * as read (all rows); `labels` may replace the stored labels with recomputed ones.
 */
export function studyExports(args: {
  study: Study;
  run: number;
  table: Table;
  appVersion: string;
  createdAt: string;
  events?: boolean | SegmentOptions;
  labelFirstPerKind?: number;
}): StudyExportFile[] {
  const { study } = args;
  const run = study.runs[args.run];
  if (!run) throw new Error(`studyExports: no run ${args.run} (the study has ${study.runs.length})`);
  const input = study.inputs[run.input];
  const { result } = run;
  const { table, roles } = result.windows ? keepRows(args.table, run.roles, result.windows) : { table: args.table, roles: run.roles };
  const state = runCuration(run);
  const identities = clusterIdentities({ state, table, roles });
  const base = baseName(input.fileName);

  const provenance = {
    ...buildProvenance({
      input: { fileName: input.fileName, sha256: input.sha256, rows: table.nRows, features: run.roles.filter((r) => r.role === 'feature').length },
      roles: run.roles,
      params: run.params as unknown as AnalysisParams,
      result,
      identities,
      appVersion: args.appVersion,
      createdAt: args.createdAt,
    }),
    study: { run: run.id, runCreatedAt: run.createdAt },
    curation: {
      actions: run.curation.actions.map(actionRecord),
      clusters: state.clusters.map((c, i) => ({ number: identities[i].number, ...c, mergedInto: c.mergedInto < 0 ? null : identities[c.mergedInto].number, size: identities[i].size })),
    },
  };
  const files: StudyExportFile[] = [
    { name: `${base}-weak-labels.csv`, data: weakLabelsCsv({ table, roles, result, identities, labels: state.labels }) },
    { name: `${base}-provenance.json`, data: `${JSON.stringify(provenance, null, 2)}\n` },
    {
      name: `${base}-label-first.csv`,
      data: labelFirstCsv(table, roles, labelFirstList({ labels: state.labels, confidence: result.confidence, identities, perKind: args.labelFirstPerKind }), identities),
    },
  ];
  if (args.events) {
    const segments = eventSegments({
      table, roles, labels: state.labels, confidence: result.confidence, identities,
      options: typeof args.events === 'object' ? args.events : {},
    });
    files.push({ name: `${base}-events.tsv`, data: eventsTsv(segments) });
    for (const f of edfAnnotationFiles(segments)) files.push({ name: f.name, data: f.bytes });
  }
  return files;
}
