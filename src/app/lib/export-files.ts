import { buildProvenance } from '../../core/export/provenance';
import { weakLabelsCsv } from '../../core/export/weak-labels';
import type { Table } from '../../core/table/table';
import type { FileToWrite } from '../../host/host';
import type { Run, Source } from '../state/study.svelte';

/** The file name without its last extension ("windows.csv" → "windows"). */
export function baseName(fileName: string): string {
  const dot = fileName.lastIndexOf('.');
  return dot > 0 ? fileName.slice(0, dot) : fileName;
}

/** The weak-label table and its provenance, ready for host.saveFiles. */
export function weakLabelFiles(args: {
  source: Source;
  table: Table;
  run: Run;
  clusterNames: string[];
  appVersion: string;
  createdAt: string;
}): FileToWrite[] {
  const { source, table, run, clusterNames } = args;
  const csv = weakLabelsCsv({ table, roles: run.roles, result: run.result, clusterNames });
  const provenance = buildProvenance({
    input: { fileName: source.fileName, sha256: source.sha256, rows: table.nRows, features: run.featureNames.length },
    roles: run.roles,
    params: run.params,
    result: run.result,
    clusterNames,
    appVersion: args.appVersion,
    createdAt: args.createdAt,
  });
  const base = baseName(source.fileName);
  return [
    { name: `${base}-weak-labels.csv`, data: csv },
    { name: `${base}-provenance.json`, data: `${JSON.stringify(provenance, null, 2)}\n` },
  ];
}
