import { existsSync, realpathSync } from 'node:fs';
import { join } from 'node:path';
import type { AnalysisResult } from '../core/analysis.types';
import { edfAnnotationFiles } from '../core/export/edf-annotations';
import { eventsTsv } from '../core/export/events-tsv';
import type { ClusterIdentity } from '../core/export/run-model';
import { eventSegments } from '../core/export/segments';
import type { Roles } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import { UsageError } from './usage-error';
import { writeFileAtomic } from './write-atomic';

/**
 * `analyze --events`: the run's clusters (all candidates, nothing curated yet) as event segments,
 * written to <out>/events.tsv and one EDF+ annotation file per subject. `table` and `roles` are the
 * analysed windows (after any rows the recipe dropped). Returns the paths written.
 */
export function writeEventFiles(
  outDir: string, input: string, table: Table, roles: Roles, result: AnalysisResult, identities: readonly ClusterIdentity[],
): string[] {
  const segments = eventSegments({ table, roles, labels: result.labels, confidence: result.confidence, identities });
  const files = [
    { path: join(outDir, 'events.tsv'), data: eventsTsv(segments) as string | Uint8Array },
    ...edfAnnotationFiles(segments).map((f) => ({ path: join(outDir, f.name), data: f.bytes })),
  ];
  const inputReal = existsSync(input) ? realpathSync(input) : '';
  for (const f of files) {
    if (existsSync(f.path) && realpathSync(f.path) === inputReal) throw new UsageError(`refusing to write ${f.path}: it is the input file; choose another --out`);
  }
  for (const f of files) writeFileAtomic(f.path, f.data);
  return files.map((f) => f.path);
}
