/** The one shared selection of windows: a mask over the rows of the current result. */
export class Selection {
  mask = $state.raw<Uint8Array | null>(null);
  count = $state(0);
  /**
   * The one window under the pointer in any view (a row of the current result, -1 = none), so
   * every view can light it up: the Map rings it, Traces (and other views) outline it.
   */
  highlight = $state(-1);
  /** Windows under the branch hovered in the Tree (the Map lights them up); null = none. */
  branch = $state.raw<Uint8Array | null>(null);
  branchCount = $state(0);

  setBranch(mask: Uint8Array | null, count: number): void {
    this.branch = mask;
    this.branchCount = mask ? count : 0;
  }

  set(mask: Uint8Array): void {
    let count = 0;
    for (let i = 0; i < mask.length; i++) count += mask[i];
    this.mask = mask;
    this.count = count;
  }

  clear(): void {
    this.mask = null;
    this.count = 0;
  }
}
