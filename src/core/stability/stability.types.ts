/** Options of a stability assessment across subjects (see docs/stability.md). */
export interface StabilityOptions {
  /** Resamples (B). */
  resamples: number;
  /** Share of the subjects left out of each resample, 0 ≤ share < 1 (default 0.25). */
  leaveOutShare?: number;
  /** Seed of the subject draws; default the run's seed. */
  seed?: number;
}

/** A subject whose absence went with the cluster dissolving. */
export interface DissolvingSubject {
  subject: string;
  /** Resamples that left this subject out. */
  leftOut: number;
  /** Of those, the resamples in which the cluster dissolved. */
  dissolved: number;
  /** dissolved / leftOut. */
  share: number;
}

export interface ClusterStability {
  cluster: number;
  /** Mean over the resamples of the best Jaccard similarity (0..1); null for a set-aside noise cluster. */
  meanJaccard: number | null;
  /** Share of the resamples in which the cluster dissolved (best Jaccard ≤ 0.5); null for noise. */
  dissolvedShare: number | null;
  /**
   * Subjects whose absence made the cluster dissolve more often than it did over all resamples,
   * most often first (at most 3): each dissolved it at least once, at a higher rate than dissolvedShare.
   */
  dissolvingSubjects: DissolvingSubject[];
}

export interface StabilityResult {
  resamples: number;
  leaveOutShare: number;
  /** Subjects left out of each resample (the same number each time). */
  subjectsLeftOut: number;
  /** Subjects in the table (windows without a subject are always kept). */
  subjects: number;
  seed: number;
  /** A cluster dissolves in a resample when its best Jaccard similarity is at most this. */
  dissolution: number;
  clusters: ClusterStability[];
  /** The subject codes left out of each resample, ascending. */
  leftOut: number[][];
  /** Best Jaccard per resample and cluster (resamples × k, row-major); NaN for a noise cluster. */
  jaccard: Float64Array;
}
