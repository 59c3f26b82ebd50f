import type { AnalysisParams, AnalysisResult, FeatureMatrix } from '../core/analysis.types';
import { analyze } from '../core/analyze';
import type { JobContext } from '../core/job';
import { checkTable, type TableWarning } from '../core/table/checks';
import { detectFormat, tableFormat } from '../core/table/format';
import { createTableReader } from '../core/table/reader';
import type { ReadOptions, TableFormat } from '../core/table/reader.types';
import { inferRoles } from '../core/table/roles';
import type { RoleOverrides, Roles } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import type { JobHandler } from './host';

export interface ParseJob {
  fileName: string;
  /** The whole file, or its chunks in order (each is released once parsed). */
  bytes: Uint8Array | Uint8Array[];
  /** Detected from the magic bytes and the extension when absent. */
  format?: TableFormat;
  options?: ReadOptions;
  overrides?: RoleOverrides;
}
export interface ParseResult {
  table: Table;
  roles: Roles;
  /** Problems that do not stop the analysis (for example a subject with a single window). */
  warnings: TableWarning[];
}

/** Text is parsed this many bytes at a time, with progress and a cancel check in between. */
const SLICE = 4 * 1024 * 1024;

export interface AnalyzeJob {
  matrix: FeatureMatrix;
  params: AnalysisParams;
}

/** The jobs every host serves, by name. Handlers are thin: all work is in the core. */
export const jobs = {
  async parse(payload: ParseJob, ctx: JobContext): Promise<ParseResult> {
    const chunks = Array.isArray(payload.bytes) ? payload.bytes : [payload.bytes];
    const total = chunks.reduce((s, c) => s + c.length, 0);
    const format = payload.format !== undefined ? tableFormat(payload.format) : detectFormat(payload.fileName, chunks[0] ?? new Uint8Array(0));
    const reader = createTableReader(format, payload.fileName, { totalBytes: total, ...payload.options });
    ctx.progress('reading', 0);
    for (let c = 0; c < chunks.length; c++) {
      const chunk = chunks[c];
      for (let at = 0; at < chunk.length; at += SLICE) {
        reader.push(chunk.subarray(at, Math.min(chunk.length, at + SLICE)));
        ctx.progress('reading', reader.bytesConsumed / Math.max(1, total));
        await ctx.checkpoint();
      }
    }
    const table = await reader.finish({ progress: (_stage, f) => ctx.progress('decoding', f), checkpoint: () => ctx.checkpoint() });
    const roles = inferRoles(table, payload.overrides);
    const warnings = checkTable(table, roles);
    ctx.progress('reading', 1);
    return { table, roles, warnings };
  },
  async analyze(payload: AnalyzeJob, ctx: JobContext): Promise<AnalysisResult> {
    return analyze(payload.matrix, payload.params, ctx);
  },
} satisfies Record<string, JobHandler>;

export type JobName = keyof typeof jobs;
