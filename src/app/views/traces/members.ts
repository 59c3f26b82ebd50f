/**
 * The members of a cluster worth looking at: the most typical (highest confidence) and the most
 * borderline (lowest confidence). Confidence is the run's per-window 1 − d₁/d₂ (d₁, d₂: distances
 * to the nearest and second-nearest centre), so the highest values are the windows nearest their
 * own centre relative to the next one; no distances are recomputed here.
 */
export interface ClusterMembers {
  typical: number[];
  borderline: number[];
  /** Windows in the cluster. */
  size: number;
}

export function clusterMembers(labels: Int32Array, confidence: Float32Array, cluster: number, n: number): ClusterMembers {
  const members: number[] = [];
  for (let i = 0; i < labels.length; i++) if (labels[i] === cluster) members.push(i);
  // Ties broken by window order, so the choice is stable.
  members.sort((a, b) => confidence[b] - confidence[a] || a - b);
  const typical = members.slice(0, Math.min(n, members.length));
  const rest = members.slice(typical.length);
  const borderline = rest.slice(Math.max(0, rest.length - n)).reverse();
  return { typical, borderline, size: members.length };
}

/** The first `max` selected windows (mask order) and how many are selected in all. */
export function selectedWindows(mask: Uint8Array | null, max: number): { shown: number[]; total: number } {
  const shown: number[] = [];
  let total = 0;
  if (!mask) return { shown, total };
  for (let i = 0; i < mask.length; i++) {
    if (!mask[i]) continue;
    total++;
    if (shown.length < max) shown.push(i);
  }
  return { shown, total };
}
