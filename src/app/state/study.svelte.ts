import type { AnalysisParams, AnalysisResult } from '../../core/analysis.types';
import type { Role, Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';

/** Where the current windows table came from, for provenance. */
export interface Source {
  fileName: string;
  sha256: string;
  bytes: number;
}

/** The result of one run together with what it was run on. */
export interface Run {
  result: AnalysisResult;
  params: AnalysisParams;
  /** Roles as they were when the run started (the export records these). */
  roles: Roles;
  featureNames: string[];
}

/** The open study: the table, its column roles, the latest run and the names given to clusters. */
export class Study {
  source = $state.raw<Source | null>(null);
  table = $state.raw<Table | null>(null);
  roles = $state<Roles>([]);
  run = $state.raw<Run | null>(null);
  /** One name per cluster of the latest run; '' = still a candidate (unnamed). */
  clusterNames = $state<string[]>([]);

  /** Replaces everything with a freshly loaded table (only after it loaded without error). */
  load(source: Source, table: Table, roles: Roles): void {
    this.source = source;
    this.table = table;
    this.roles = roles;
    this.run = null;
    this.clusterNames = [];
  }

  setRole(index: number, role: Role): void {
    const r = this.roles[index];
    if (!r || r.role === role) return;
    this.roles[index] = { ...r, role, evidence: `set by you (was ${r.role})` };
  }

  setRun(run: Run): void {
    this.run = run;
    this.clusterNames = Array.from({ length: run.result.cluster.k }, () => '');
  }

  rename(cluster: number, name: string): void {
    if (cluster >= 0 && cluster < this.clusterNames.length) this.clusterNames[cluster] = name.trim();
  }

  /** The display name of a cluster: its class name, or "candidate N". */
  displayName(cluster: number): string {
    return this.clusterNames[cluster] || `candidate ${cluster + 1}`;
  }
}
