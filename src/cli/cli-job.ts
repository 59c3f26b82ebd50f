import type { JobClient, RunningJob } from '../worker/client';
import type { Jobs } from '../worker/jobs';
import type { PayloadOf, ResultOf } from '../worker/protocol';
import type { ProgressReporter } from './progress-bar';

/** What a command needs to run one job on its worker thread. */
export interface CliJobDeps {
  client: JobClient<Jobs>;
  progress: ProgressReporter;
  /** Called with the running job (so that Ctrl-C can cancel it), then with null when it ends. */
  onJob(job: RunningJob<unknown> | null): void;
}

/** Runs one job on the worker with its progress on the terminal ("<label>: <stage>"); Ctrl-C cancels it. */
export async function runCliJob<N extends keyof Jobs & string>(
  deps: CliJobDeps, job: N, payload: PayloadOf<Jobs, N>, label: string, transfer: ArrayBuffer[] = [],
): Promise<ResultOf<Jobs, N>> {
  const running = deps.client.run(job, payload, {
    transfer,
    onProgress: (p) => deps.progress.update(`${label}: ${p.stage}`, p.fraction, p.detail),
  });
  deps.onJob(running as RunningJob<unknown>);
  try {
    return await running.result;
  } finally {
    deps.onJob(null);
    deps.progress.finish();
  }
}
