import { CancelledError, InputError, OptionError } from '../core/errors';
import { UsageError } from './usage-error';

/**
 * The one stderr line a subcommand (`gleaner run`, `gleaner apply`) ends with when it fails, and its
 * exit code: 2 for a bad command line (pointing at `gleaner <command> --help`), 130 when cancelled,
 * 1 for bad input, a file that cannot be opened, or any other failure (its stack only with
 * GLEANER_DEBUG set).
 */
export function commandFailure(err: unknown, command: string): number {
  const message = (err instanceof Error ? err.message : String(err)).replace(/\s*\n\s*/g, ' ');
  if (err instanceof UsageError || err instanceof OptionError) {
    process.stderr.write(`gleaner: ${message} (see gleaner ${command} --help)\n`);
    return 2;
  }
  if (err instanceof CancelledError) {
    process.stderr.write('gleaner: cancelled\n');
    return 130;
  }
  const sys = err as { code?: unknown; path?: unknown };
  if (typeof sys.code === 'string' && typeof sys.path === 'string') {
    process.stderr.write(`gleaner: cannot open ${sys.path}: ${sys.code === 'ENOENT' ? 'no such file or folder' : sys.code}\n`);
    return 1;
  }
  process.stderr.write(`gleaner: ${err instanceof InputError ? '' : 'error: '}${message}\n`);
  if (process.env.GLEANER_DEBUG && err instanceof Error) process.stderr.write(`${err.stack}\n`);
  return 1;
}
