import type { ColumnComposition } from '../../../core/composition/compose-column';

/** One value's part of a cluster's bar. */
export interface MixSegment {
  cluster: number;
  value: string;
  /** Category code of the value (its colour and its selection key). */
  code: number;
  windows: number;
  /** Where the segment starts and how wide it is, as shares of the cluster (0..1). */
  start: number;
  share: number;
  /** Windows of this segment in the shared selection. */
  selected: number;
}

/** One cluster's bar: its mix of values, most frequent first, with the bound verdict. */
export interface MixBar {
  cluster: number;
  size: number;
  bound: boolean;
  reason: string;
  topShare: number;
  effectiveValues: number;
  segments: MixSegment[];
}

/**
 * Bars of the Mix view, the most concentrated cluster first (fewest effective values; ties by
 * cluster id). `names` are the category names in code order; `selected[c][code]` counts selected
 * windows (omit it when nothing is selected).
 */
export function mixBars(comp: ColumnComposition, names: readonly string[], selected?: readonly (ArrayLike<number>)[]): MixBar[] {
  const codeOf = new Map(names.map((n, i) => [n, i]));
  return comp.clusters
    .filter((c) => c.size > 0)
    .map((c): MixBar => {
      let at = 0;
      const segments = c.byValue.map((v): MixSegment => {
        const code = codeOf.get(v.value) ?? -1;
        const share = v.windows / c.size;
        const s = { cluster: c.id, value: v.value, code, windows: v.windows, start: at, share, selected: code >= 0 ? (selected?.[c.id]?.[code] ?? 0) : 0 };
        at += share;
        return s;
      });
      return { cluster: c.id, size: c.size, bound: c.bound, reason: c.boundReason, topShare: c.topShare, effectiveValues: c.effectiveValues, segments };
    })
    .sort((a, b) => a.effectiveValues - b.effectiveValues || a.cluster - b.cluster);
}

/**
 * Selected windows per cluster and value: counts[c][code]. `labels` and `mask` are over the run's
 * windows, `rows` maps them to table rows and `codes` holds each table row's value code.
 */
export function selectedByValue(
  mask: Uint8Array, labels: Int32Array, rows: Int32Array, codes: Int32Array, k: number, values: number,
): Int32Array[] {
  const counts = Array.from({ length: k }, () => new Int32Array(values));
  for (let i = 0; i < labels.length; i++) {
    if (!mask[i]) continue;
    const c = labels[i], v = codes[rows[i]];
    if (c >= 0 && c < k && v >= 0 && v < values) counts[c][v]++;
  }
  return counts;
}

/** Mask of the windows of one segment: cluster `cluster` and value code `code`. */
export function segmentMask(labels: Int32Array, rows: Int32Array, codes: Int32Array, cluster: number, code: number): Uint8Array {
  const mask = new Uint8Array(labels.length);
  for (let i = 0; i < labels.length; i++) if (labels[i] === cluster && codes[rows[i]] === code) mask[i] = 1;
  return mask;
}

/** Columns worth composing by: subject, session, metadata and label columns, subject first. */
export function composableColumns(roles: readonly { name: string; role: string }[]): string[] {
  const order = ['subject', 'session', 'metadata', 'label'];
  return roles
    .filter((r) => order.includes(r.role))
    .sort((a, b) => order.indexOf(a.role) - order.indexOf(b.role))
    .map((r) => r.name);
}

/** "0.19", "n/a" for NaN; p-values as "< 1e-6" when tiny. */
export function fmt(x: number, digits = 2): string {
  return Number.isFinite(x) ? x.toFixed(digits) : 'n/a';
}

export function fmtP(p: number): string {
  if (!Number.isFinite(p)) return 'n/a';
  return p < 1e-6 ? '< 1e-6' : p < 0.001 ? p.toExponential(1) : p.toFixed(3);
}
