/** The one shared selection of windows: a mask over the rows of the current result. */
export class Selection {
  mask = $state.raw<Uint8Array | null>(null);
  count = $state(0);

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
