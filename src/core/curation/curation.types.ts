/**
 * The curation of one run: which cluster each window is in now, and what the user said about each
 * cluster. States are immutable: an action returns a new state and shares every part it left alone
 * (the labels array is copied only by actions that move windows).
 */
export interface ClusterNote {
  /** Working name shown in the views ('' = none yet). */
  name: string;
  /** Display colour, "#rrggbb" ('' = the palette's colour for this index). */
  colour: string;
  description: string;
  /** Set aside as noise: its windows are exported with set_aside = 1 and no class. */
  setAside: boolean;
  /** Class name once the candidate is promoted to a class ('' = still a candidate). */
  className: string;
  /** Emptied by a merge into this cluster index (-1 = not merged). */
  mergedInto: number;
}

export interface CurationState {
  /** Cluster index per analysed window (same order as the run's labels). */
  readonly labels: Int32Array;
  readonly clusters: readonly Readonly<ClusterNote>[];
}

export type CurationAction =
  | { type: 'name'; cluster: number; name: string }
  | { type: 'colour'; cluster: number; colour: string }
  | { type: 'describe'; cluster: number; description: string }
  /** Moves every window of `from` into `into`; the emptied clusters keep their index. */
  | { type: 'merge'; into: number; from: number[] }
  /**
   * Re-clusters inside `cluster`: `parts` holds one part index (0..k-1) per window of the cluster,
   * in window order, as computed by the caller (k-means on those windows). Part 0 stays in
   * `cluster`; part j > 0 becomes a new cluster appended at the end.
   */
  | { type: 'split'; cluster: number; k: number; parts: Int32Array }
  | { type: 'set-aside'; cluster: number; value: boolean }
  /** Moves the listed windows (analysed-window indices) into `to` (an existing cluster, or clusters.length for a new one). */
  | { type: 'move'; windows: Int32Array; to: number }
  /** Candidate → class: the cluster becomes the class `className` (non-empty). */
  | { type: 'promote'; cluster: number; className: string };
