import { CancelledError } from '../../core/errors';

/** A message for the error banner that always names the file it is about. */
export function describeError(err: unknown, fileName: string): string {
  const message = err instanceof Error ? err.message : String(err);
  return message.includes(fileName) ? message : `${fileName}: ${message}`;
}

export function isCancelled(err: unknown): boolean {
  return err instanceof CancelledError || (err instanceof Error && err.name === 'CancelledError');
}
