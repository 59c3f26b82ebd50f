import type { AnalysisParams, AnalysisResult, FeatureMatrix } from '../core/analysis.types';
import { analyze } from '../core/analyze';
import { createSha256 } from '../core/hash/sha256';
import type { JobContext } from '../core/job';
import { profileRun, type ProfileInput, type RunProfile } from '../core/profile/profile';
import { checkTable, type TableWarning } from '../core/table/checks';
import { detectFormat, tableFormat } from '../core/table/format';
import { createTableReader, readsByOffset, readTableSource } from '../core/table/reader';
import { blobSource } from '../core/raw/byte-source';
import { hashingSource } from '../core/hash/hashing-source';
import type { ReadOptions, TableFormat } from '../core/table/reader.types';
import { inferRoles } from '../core/table/roles';
import type { RoleOverrides, Roles } from '../core/table/roles.types';
import type { Table } from '../core/table/table';
import { dataQuality, type DataQuality } from '../core/quality';
import { RecipeCache } from '../core/recipe/recipe-cache';
import { hashBlob, type BlobHasher, type RunningBlobHash } from './blob-hash';
import type { JobHandler } from './host';
import { splitCluster, type SplitJob } from './split-cluster';
import { recutJob, type RecutJob, type RecutResult } from './recut-job';
import { sweepJob, type SweepJob } from './sweep-job';
import type { SweepRow } from '../core/cluster/sweep';

export interface ParseJob {
  fileName: string;
  /** The whole file, or its chunks in order (each is released once parsed). */
  bytes?: Uint8Array | Uint8Array[];
  /** Or the file itself (browser File / Blob): read here one slice at a time, never whole. */
  blob?: Blob;
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
  /** Hex SHA-256 of the bytes read, computed slice by slice. */
  sha256: string;
}

/** Text is parsed this many bytes at a time, with progress and a cancel check in between. */
const SLICE = 4 * 1024 * 1024;

export interface AnalyzeJob {
  matrix: FeatureMatrix;
  params: AnalysisParams;
  /**
   * Names the matrix (the app: file hash + column roles). Runs with the key of the previous run
   * reuse its matrix and RecipeCache, so only the recipe steps after the first changed one run again.
   */
  cacheKey?: string;
}

export interface QualityJob {
  matrix: FeatureMatrix;
  /** Name of each subject code in matrix.subjectCodes. */
  subjectNames?: string[];
}

/**
 * The worker keeps one RecipeCache, for the matrix of the latest keyed run. It is replaced (and
 * the old one freed) when a run comes with another key: another file, or changed column roles.
 */
let recipeSlot: { key: string; matrix: FeatureMatrix; cache: RecipeCache } | null = null;

/** The input in file order, at most SLICE bytes at a time; a Blob is read slice by slice. */
async function* slicesOf(payload: ParseJob): AsyncGenerator<Uint8Array> {
  const { blob } = payload;
  if (blob) {
    for (let at = 0; at < blob.size; at += SLICE) yield new Uint8Array(await blob.slice(at, Math.min(blob.size, at + SLICE)).arrayBuffer());
    return;
  }
  const bytes = payload.bytes ?? [];
  for (const chunk of Array.isArray(bytes) ? bytes : [bytes]) {
    for (let at = 0; at < chunk.length; at += SLICE) yield chunk.subarray(at, Math.min(chunk.length, at + SLICE));
  }
}

let blobHasher: BlobHasher | null = null;

/** Lets the parse job hash a Blob on another thread (the app's worker starts a nested worker). */
export function useBlobHasher(hasher: BlobHasher | null): void {
  blobHasher = hasher;
}

/** The jobs every host serves, by name. Handlers are thin: all work is in the core. */
export const jobs = {
  async parse(payload: ParseJob, ctx: JobContext): Promise<ParseResult> {
    const bytes = payload.bytes ?? [];
    const { blob } = payload;
    const total = blob ? blob.size : (Array.isArray(bytes) ? bytes : [bytes]).reduce((s, c) => s + c.length, 0);
    // A Blob is hashed on another thread where the host can start one (the app's worker), so the
    // SHA-256 costs no wall time on a second core; otherwise here, on the way through the reads.
    const elsewhere: RunningBlobHash | null = blob && blobHasher ? blobHasher(blob) : null;
    const hash = createSha256();
    const formatOf = (first: Uint8Array) => (payload.format !== undefined ? tableFormat(payload.format) : detectFormat(payload.fileName, first));
    const decoding: JobContext = { progress: (_stage, f) => ctx.progress('decoding', f), checkpoint: () => ctx.checkpoint() };
    ctx.progress('reading', 0);
    let table: Table;
    try {
      const blobFormat = blob ? formatOf(new Uint8Array(await blob.slice(0, 8).arrayBuffer())) : null;
      if (blob && blobFormat && readsByOffset(blobFormat)) {
        // A File read by offset (Parquet): one row group in memory at a time, hashed on the way.
        const source = blobSource(blob);
        const hashing = elsewhere ? null : hashingSource(source, hash);
        table = await readTableSource(blobFormat, payload.fileName, hashing ?? source, { totalBytes: total, ...payload.options }, decoding);
        await hashing?.finish();
      } else {
        let reader: ReturnType<typeof createTableReader> | null = null;
        for await (const slice of slicesOf(payload)) {
          reader ??= createTableReader(blobFormat ?? formatOf(slice), payload.fileName, { totalBytes: total, ...payload.options });
          if (!elsewhere) hash.update(slice);
          reader.push(slice);
          ctx.progress('reading', reader.bytesConsumed / Math.max(1, total));
          await ctx.checkpoint();
        }
        reader ??= createTableReader(blobFormat ?? formatOf(new Uint8Array(0)), payload.fileName, { totalBytes: total, ...payload.options });
        table = await reader.finish(decoding);
      }
      const roles = inferRoles(table, payload.overrides);
      const warnings = checkTable(table, roles);
      // Should the hashing thread fail, the file is hashed here after all.
      const sha256 = elsewhere && blob ? await elsewhere.digest.catch(() => hashBlob(blob)) : hash.hex();
      ctx.progress('reading', 1);
      return { table, roles, warnings, sha256 };
    } catch (err) {
      elsewhere?.stop();
      throw err;
    }
  },
  async analyze(payload: AnalyzeJob, ctx: JobContext): Promise<AnalysisResult> {
    const { cacheKey } = payload;
    if (cacheKey === undefined) return analyze(payload.matrix, payload.params, ctx);
    if (recipeSlot?.key !== cacheKey) recipeSlot = { key: cacheKey, matrix: payload.matrix, cache: new RecipeCache() };
    return analyze(recipeSlot.matrix, payload.params, ctx, recipeSlot.cache);
  },
  /** The data-quality report of a feature matrix (the Quality view). */
  async quality(payload: QualityJob): Promise<DataQuality> {
    return dataQuality(payload.matrix, payload.matrix.subjectCodes, payload.subjectNames);
  },
  /** Composition by a column, fingerprints and label agreement of one run (the Mix and Fingerprints views). */
  async profile(payload: ProfileInput): Promise<RunProfile> {
    return profileRun(payload);
  },
  /** Re-clusters one cluster's windows (curation: split). */
  async split(payload: SplitJob, ctx: JobContext): Promise<Int32Array> {
    return splitCluster(payload, ctx);
  },
  /** k-means over a range of k with inertia, silhouette, Calinski–Harabasz and Davies–Bouldin (the sweep view). */
  async sweep(payload: SweepJob, ctx: JobContext): Promise<SweepRow[]> {
    return sweepJob(payload, ctx);
  },
  /** Confidence and cluster means of a new cut of the tree (the Tree view's cut line). */
  async recut(payload: RecutJob, ctx: JobContext): Promise<RecutResult> {
    return recutJob(payload, ctx);
  },
} satisfies Record<string, JobHandler>;

export type JobName = keyof typeof jobs;
