/**
 * What a long-running core computation sees of its driver. Kernels stay pure: the driver (a Web
 * Worker, a Node worker thread, or a test) decides how progress is shown and how cancellation
 * arrives.
 */
export interface JobContext {
  /** Report progress: a stage name and the fraction done of the whole job (0..1). */
  progress(stage: string, fraction: number): void;
  /**
   * Called between slices of work. Resolves when the job may go on; rejects with CancelledError
   * when it was cancelled. Drivers yield to their event loop here so cancel messages get in.
   */
  checkpoint(): Promise<void>;
}

/** A context for tests and synchronous callers: no progress, never cancelled. */
export const quietContext: JobContext = {
  progress() {},
  checkpoint: () => Promise.resolve(),
};
