import type { Roles } from '../../../core/table/roles.types';
import type { Table } from '../../../core/table/table';
import type { Run } from '../../../core/run/run.types';
import { MAX_TRACES } from '../../state/traces.svelte';
import { clusterMembers, selectedWindows } from './members';
import { traceWindows, type TraceWindow } from './windows';

export interface PlanSection {
  title: string;
  group: 'selected' | 'typical' | 'borderline';
  windows: TraceWindow[];
}

/** What the view shows: the focused cluster's typical and borderline members, else the selection. */
export type Plan = { sections: PlanSection[] } | { note: string };

export function tracePlan(table: Table, run: Run, roles: Roles, mask: Uint8Array | null, focus: number, perGroup: number, clusterName: (c: number) => string): Plan {
  const { result } = run;
  const rowOf = (i: number) => (result.windows ? result.windows[i] : i);
  const make = (title: string, group: PlanSection['group'], indices: number[]): PlanSection | string => {
    const w = traceWindows(table, roles, indices, rowOf);
    return typeof w === 'string' ? w : { title, group, windows: w };
  };
  let parts: (PlanSection | string)[];
  if (focus >= 0 && focus < result.cluster.k) {
    const m = clusterMembers(result.labels, result.confidence, focus, perGroup);
    if (m.size === 0) return { note: `${clusterName(focus)} has no windows.` };
    parts = [
      make(`Most typical of ${clusterName(focus)} (highest confidence, ${m.typical.length} of ${m.size})`, 'typical', m.typical),
      ...(m.borderline.length > 0 ? [make(`Most borderline of ${clusterName(focus)} (lowest confidence)`, 'borderline', m.borderline)] : []),
    ];
  } else {
    const sel = selectedWindows(mask, MAX_TRACES);
    if (sel.total === 0) return { note: 'Select windows on the Map, or focus a cluster, to see their raw signals.' };
    parts = [make(sel.total > sel.shown.length ? `Selected windows (first ${sel.shown.length} of ${sel.total})` : `Selected windows (${sel.total})`, 'selected', sel.shown)];
  }
  const problem = parts.find((p): p is string => typeof p === 'string');
  return problem ? { note: problem } : { sections: parts as PlanSection[] };
}
