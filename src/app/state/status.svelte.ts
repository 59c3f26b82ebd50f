/** What the app is doing now (status bar) and the last problem to show (error banner). */
export class Status {
  /** Words for the status bar. */
  message = $state('Open a windows file (CSV) or load the demo study to begin.');
  /** A job is running: the progress bar and Cancel are shown. */
  busy = $state(false);
  stage = $state('');
  fraction = $state(0);
  /** Shown in the banner until dismissed or replaced; null when there is nothing to show. */
  error = $state<{ title: string; message: string } | null>(null);

  start(message: string): void {
    this.busy = true;
    this.stage = '';
    this.fraction = 0;
    this.message = message;
  }

  progress(stage: string, fraction: number): void {
    this.stage = stage;
    this.fraction = fraction;
  }

  finish(message: string): void {
    this.busy = false;
    this.fraction = 0;
    this.stage = '';
    this.message = message;
  }

  fail(title: string, message: string, statusMessage: string): void {
    this.finish(statusMessage);
    this.error = { title, message };
  }

  dismissError(): void {
    this.error = null;
  }
}
