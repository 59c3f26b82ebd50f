import type { AnalysisParams, AnalysisResult, FeatureMatrix } from '../core/analysis.types';
import { analyze } from '../core/analyze';
import type { JobContext } from '../core/job';
import { parseCsv } from '../core/table/csv';
import { inferRoles } from '../core/table/roles';
import type { RoleOverrides, Roles } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import type { JobHandler } from './host';

export interface ParseJob {
  fileName: string;
  bytes: Uint8Array;
  overrides?: RoleOverrides;
}
export interface ParseResult {
  table: Table;
  roles: Roles;
}

export interface AnalyzeJob {
  matrix: FeatureMatrix;
  params: AnalysisParams;
}

/** The jobs every host serves, by name. Handlers are thin: all work is in the core. */
export const jobs = {
  async parse(payload: ParseJob, ctx: JobContext): Promise<ParseResult> {
    ctx.progress('reading', 0);
    const table = parseCsv(payload.bytes, payload.fileName);
    await ctx.checkpoint();
    const roles = inferRoles(table, payload.overrides);
    ctx.progress('reading', 1);
    return { table, roles };
  },
  async analyze(payload: AnalyzeJob, ctx: JobContext): Promise<AnalysisResult> {
    return analyze(payload.matrix, payload.params, ctx);
  },
} satisfies Record<string, JobHandler>;

export type JobName = keyof typeof jobs;
