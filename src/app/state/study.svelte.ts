import type { Run, Source } from '../../core/run/run.types';
import type { Role, Roles } from '../../core/table/roles.types';
import type { Table } from '../../core/table/table';
import { runName, type KeptRun } from './kept-run';

export type { Run, Source };

/** The open study: the table, its column roles, the latest run and the names given to clusters. */
export class Study {
  source = $state.raw<Source | null>(null);
  table = $state.raw<Table | null>(null);
  roles = $state<Roles>([]);
  run = $state.raw<Run | null>(null);
  /** One name per cluster of the latest run; '' = still a candidate (unnamed). */
  clusterNames = $state<string[]>([]);
  /** Every run of this study, oldest first; `run` is the one shown (runs.svelte.ts). */
  kept = $state.raw<KeptRun[]>([]);

  /** Replaces everything with a freshly loaded table (only after it loaded without error). */
  load(source: Source, table: Table, roles: Roles): void {
    this.source = source;
    this.table = table;
    this.roles = roles;
    this.run = null;
    this.clusterNames = [];
    this.kept = [];
  }

  setRole(index: number, role: Role): void {
    const r = this.roles[index];
    if (!r || r.role === role) return;
    this.roles[index] = { ...r, role, evidence: `set by you (was ${r.role})` };
  }

  /** Keeps a new run and shows it. */
  setRun(run: Run): void {
    const id = (this.kept.at(-1)?.id ?? 0) + 1;
    this.kept = [...this.kept, { id, name: runName(id, run), run, names: [] }];
    this.show(id);
  }

  /** Shows a kept run (the names given to the clusters of the run shown so far are kept with it). */
  show(id: number): void {
    const next = this.kept.find((k) => k.id === id);
    if (!next) return;
    const current = this.kept.find((k) => k.run === this.run);
    if (current) current.names = $state.snapshot(this.clusterNames);
    this.run = next.run;
    this.clusterNames = next.names.length === next.run.result.cluster.k ? next.names.slice() : Array.from({ length: next.run.result.cluster.k }, () => '');
  }

  rename(cluster: number, name: string): void {
    if (cluster >= 0 && cluster < this.clusterNames.length) this.clusterNames[cluster] = name.trim();
  }

  /** Names clusters from the curation of the shown run (curation.svelte.ts sets it; the one place names live). */
  namer: ((cluster: number) => string) | null = null;

  /** The display name of a cluster: its class name, or "candidate N". */
  displayName(cluster: number): string {
    return this.namer ? this.namer(cluster) : this.clusterNames[cluster] || `candidate ${cluster + 1}`;
  }
}
