import { CancelledError, InputError, OptionError } from '../core/errors';
import type { RunningJob } from '../worker/client';
import { analyzeCommand } from './analyze-command';
import { parseArgs, USAGE, UsageError } from './args';
import { startJobThread } from './job-thread';
import { progressReporter } from './progress-bar';
import { VERSION } from './version';

/** Runs the CLI and returns its exit code: 0 done, 1 input or runtime failure, 2 usage, 130 cancelled. */
export async function runCli(argv: readonly string[]): Promise<number> {
  let command;
  try {
    command = parseArgs(argv);
  } catch (err) {
    return fail(err);
  }
  if (command.command === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  if (command.command === 'version') {
    process.stdout.write(`gleaner ${VERSION}\n`);
    return 0;
  }

  const thread = startJobThread();
  let current: RunningJob<unknown> | null = null;
  let interrupted = false;
  const onSigint = () => {
    if (interrupted) process.exit(130); // a second Ctrl-C does not wait for the job
    interrupted = true;
    current?.cancel();
  };
  process.on('SIGINT', onSigint);
  try {
    const outcome = await analyzeCommand(command, {
      client: thread.client,
      progress: progressReporter(process.stderr, command.progress),
      version: VERSION,
      onJob: (job) => {
        current = job;
        if (job && interrupted) job.cancel();
      },
    });
    if (interrupted) throw new CancelledError();
    const c = outcome.result.cluster;
    const noise = c.method === 'hdbscan' ? c.noiseCluster : null;
    const dense = Array.from(outcome.result.sizes).filter((_, j) => j !== noise);
    const clusters = noise === null ? `${c.k} clusters` : `${dense.length} clusters and ${outcome.result.sizes[noise]} noise windows (cluster ${noise + 1}, column noise)`;
    process.stdout.write(`gleaner: ${outcome.rows} windows in ${clusters} (sizes ${dense.join(', ')}); wrote ${outcome.files.join(' and ')}\n`);
    return 0;
  } catch (err) {
    return fail(err);
  } finally {
    process.off('SIGINT', onSigint);
    await thread.close();
  }
}

const SYSTEM_ERRORS: Record<string, string> = {
  ENOENT: 'no such file or folder',
  EACCES: 'permission denied',
  EISDIR: 'expected a file, found a folder',
  ENOTDIR: 'a part of the path is not a folder',
  ENOSPC: 'no space left on the device',
};

/** One line on stderr, no stack trace (unless GLEANER_DEBUG is set); returns the exit code. */
function fail(err: unknown): number {
  const message = err instanceof Error ? err.message : String(err);
  const oneLine = message.replace(/\s*\n\s*/g, ' ');
  if (err instanceof UsageError || err instanceof OptionError) {
    process.stderr.write(`gleaner: ${oneLine} (see gleaner --help)\n`);
    return 2;
  }
  if (err instanceof CancelledError) {
    process.stderr.write('gleaner: cancelled; nothing written\n');
    return 130;
  }
  if (err instanceof InputError) {
    process.stderr.write(`gleaner: ${oneLine}\n`);
    return 1;
  }
  const sys = err as { code?: unknown; path?: unknown; syscall?: unknown };
  if (typeof sys.code === 'string' && typeof sys.path === 'string') {
    const what = SYSTEM_ERRORS[sys.code] ?? sys.code;
    process.stderr.write(`gleaner: cannot ${sys.syscall === 'open' ? 'open' : 'access'} ${sys.path}: ${what}\n`);
    return 1;
  }
  process.stderr.write(`gleaner: error: ${oneLine}\n`);
  if (process.env.GLEANER_DEBUG && err instanceof Error) process.stderr.write(`${err.stack}\n`);
  return 1;
}

