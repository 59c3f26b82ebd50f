/**
 * Identities across a re-cut of a tree. A cluster's identity (number, name, colour) is its curated
 * index, so a new cut keeps identities by giving each of its clusters the index of the previous
 * cluster it continues:
 *
 * 1. Every cut cluster j is matched to the previous cluster p it shares most windows with (its
 *    "best" previous cluster). When it covers several previous clusters (a merge) that is the one it
 *    holds most windows of, so the merge keeps the larger one's index.
 * 2. When several cut clusters have the same best previous cluster (a split), the one holding most
 *    of p's windows (the largest part) keeps p's index; the others are unmatched.
 * 3. An unmatched cut cluster may take back a remembered index: a cluster an earlier re-cut dropped
 *    (merged away), when the two share a majority of each other's windows and the index is free.
 * 4. Every other unmatched cut cluster takes a fresh index after the previous maximum, in the order
 *    of the cut's own numbering.
 *
 * Ties: the lowest index wins everywhere (the lower previous index in step 1, the lower cut cluster
 * number in step 2, the lower remembered index in step 3). Pure and deterministic.
 *
 * Indices are not compacted: a previous index that keeps no cluster leaves a gap, as a curation merge
 * does (an empty cluster that is not listed); `slots` is the highest index used + 1.
 */

import type { AnalysisResult } from '../analysis.types';

/** A cluster an earlier re-cut dropped: its index and its windows (analysed-window indices). */
export interface RememberedCluster {
  index: number;
  windows: Int32Array;
}

export interface CarriedCut {
  /** Per window: the index of its cluster in the new cut, identities carried. */
  labels: Int32Array;
  /** Per cut cluster (the cut's own numbering 0..k-1): the index it was given. */
  indexOf: Int32Array;
  /** Per cut cluster: how it got its index. */
  origin: ('kept' | 'remembered' | 'new')[];
  /**
   * Previous indices that had windows but that no cut cluster kept (merged into a cluster that holds
   * more windows of another previous cluster), each with the cut cluster holding most of its windows
   * (ties: the lower cut number).
   */
  dropped: { index: number; into: number }[];
  /** Highest index used + 1 (at least the number of cut clusters). */
  slots: number;
}

/**
 * Relabels `cut` (cluster 0..k-1 per window, as cutTree numbers them) so that identities of
 * `previous` (the curated cluster index per window before the re-cut; a negative value = a window
 * with no previous cluster) persist. See the file comment for the rules.
 */
export function carryIdentities(
  previous: Int32Array, cut: Int32Array, options: { remembered?: readonly RememberedCluster[] } = {},
): CarriedCut {
  const n = cut.length;
  if (previous.length !== n) throw new Error(`carryIdentities: ${previous.length} previous labels for ${n} windows`);
  let k = 0, prevSlots = 0;
  for (let i = 0; i < n; i++) {
    const c = cut[i];
    if (!(Number.isInteger(c) && c >= 0)) throw new Error(`carryIdentities: cut label ${c} of window ${i} is not a cluster number`);
    if (c + 1 > k) k = c + 1;
    if (previous[i] + 1 > prevSlots) prevSlots = previous[i] + 1;
  }
  // Windows shared by cut cluster j and previous cluster p, sparse (a cut rarely touches many pairs).
  const overlap = new Map<number, number>();
  const cutSize = new Int32Array(k);
  for (let i = 0; i < n; i++) {
    cutSize[cut[i]]++;
    const p = previous[i];
    if (p < 0) continue;
    const key = cut[i] * prevSlots + p;
    overlap.set(key, (overlap.get(key) ?? 0) + 1);
  }
  // Step 1: each cut cluster's best previous cluster (most shared windows, ties: lower p).
  const best = new Int32Array(k).fill(-1), bestShare = new Int32Array(k);
  // And each previous cluster's largest holder (for `dropped`), ties: lower j.
  const holder = new Int32Array(prevSlots).fill(-1), holderShare = new Int32Array(prevSlots);
  const keys = [...overlap.keys()].sort((a, b) => a - b);
  for (const key of keys) {
    const j = Math.floor(key / prevSlots), p = key - j * prevSlots, w = overlap.get(key)!;
    if (w > bestShare[j]) { best[j] = p; bestShare[j] = w; }
    if (w > holderShare[p]) { holder[p] = j; holderShare[p] = w; }
  }
  // Step 2: per previous cluster, the claimant holding most of its windows (ties: lower j).
  const winner = new Int32Array(prevSlots).fill(-1);
  for (let j = 0; j < k; j++) {
    const p = best[j];
    if (p < 0) continue;
    if (winner[p] < 0 || bestShare[j] > bestShare[winner[p]]) winner[p] = j;
  }
  const indexOf = new Int32Array(k).fill(-1);
  const origin: CarriedCut['origin'] = Array.from({ length: k }, () => 'new' as const);
  const used = new Set<number>();
  for (let p = 0; p < prevSlots; p++) {
    if (winner[p] >= 0) { indexOf[winner[p]] = p; origin[winner[p]] = 'kept'; used.add(p); }
  }
  // Step 3: remembered indices, for clusters that share a majority of windows both ways. A
  // remembered cluster holds a majority of its windows in at most one cut cluster, so one pass over
  // each one's windows finds its only candidate.
  const remembered = [...(options.remembered ?? [])].sort((a, b) => a.index - b.index);
  const pick = new Int32Array(k).fill(-1), pickShare = new Int32Array(k);
  for (const r of remembered) {
    if (used.has(r.index) || !(Number.isInteger(r.index) && r.index >= 0)) continue;
    const shares = new Map<number, number>();
    for (const w of r.windows) if (w >= 0 && w < n) shares.set(cut[w], (shares.get(cut[w]) ?? 0) + 1);
    for (const [j, share] of shares) {
      if (indexOf[j] >= 0 || !(share * 2 > cutSize[j] && share * 2 > r.windows.length)) continue;
      if (share > pickShare[j]) { pick[j] = r.index; pickShare[j] = share; }
    }
  }
  for (let j = 0; j < k; j++) {
    if (pick[j] >= 0 && !used.has(pick[j])) { indexOf[j] = pick[j]; origin[j] = 'remembered'; used.add(pick[j]); }
  }
  // Step 4: fresh indices after the previous maximum (and after any index already taken).
  let next = prevSlots;
  for (const u of used) if (u + 1 > next) next = u + 1;
  for (let j = 0; j < k; j++) if (indexOf[j] < 0) indexOf[j] = next++;
  const labels = new Int32Array(n);
  let slots = 0;
  for (let i = 0; i < n; i++) labels[i] = indexOf[cut[i]];
  for (let j = 0; j < k; j++) if (cutSize[j] > 0 && indexOf[j] + 1 > slots) slots = indexOf[j] + 1;
  const dropped: CarriedCut['dropped'] = [];
  for (let p = 0; p < prevSlots; p++) if (winner[p] < 0 && holder[p] >= 0) dropped.push({ index: p, into: holder[p] });
  return { labels, indexOf, origin, dropped, slots };
}

/**
 * A recomputed hierarchical result numbered like the saved one. Reproducing a study (`gleaner run`)
 * cuts the tree again, and `cutTree` numbers clusters by lowest leaf, while the saved labels carry
 * the identities kept across re-cuts in the app (and the recorded curation refers to them). The
 * recomputed labels are relabelled by carryIdentities against the saved ones, which gives the saved
 * labels back whenever the partition is the same; the cluster means follow their clusters, and k
 * covers every saved index. Other results, and results of another length, are returned as they are.
 */
export function withSavedIdentities(saved: AnalysisResult, recomputed: AnalysisResult): AnalysisResult {
  const c = recomputed.cluster;
  if (c.method !== 'hierarchical' || saved.labels.length !== recomputed.labels.length) return recomputed;
  const carried = carryIdentities(saved.labels, recomputed.labels);
  const k = Math.max(carried.slots, saved.cluster.k);
  const sizes = new Int32Array(k);
  for (const l of carried.labels) sizes[l]++;
  const d = c.k > 0 ? recomputed.centroids.length / c.k : 0;
  const centroids = new Float64Array(k * d);
  for (let j = 0; j < c.k && j < carried.indexOf.length; j++) {
    centroids.set(recomputed.centroids.subarray(j * d, (j + 1) * d), carried.indexOf[j] * d);
  }
  return { ...recomputed, labels: carried.labels, sizes, centroids, cluster: { ...c, k } };
}
