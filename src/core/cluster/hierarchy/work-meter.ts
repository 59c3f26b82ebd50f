import type { JobContext } from '../../job';

/**
 * Counts units of work (roughly one per multiply–add) and checks in with the job context every
 * `slice` units: progress under `stage`, then a checkpoint where the driver may yield or cancel.
 */
export class WorkMeter {
  private done = 0;
  private next: number;

  constructor(
    private readonly ctx: JobContext,
    private readonly stage: string,
    private readonly slice = 2e7,
  ) {
    this.next = slice;
  }

  /** Adds work; true when a check-in is due (then call `checkIn`). */
  add(units: number): boolean {
    this.done += units;
    return this.done >= this.next;
  }

  async checkIn(fraction: number): Promise<void> {
    this.next = this.done + this.slice;
    this.ctx.progress(this.stage, Math.min(1, Math.max(0, fraction)));
    await this.ctx.checkpoint();
  }
}
