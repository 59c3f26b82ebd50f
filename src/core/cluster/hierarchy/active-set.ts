/**
 * The live cluster slots in ascending order, so that scans visit them in index order (ties go to
 * the lowest slot, as a full scan would) while skipping dead slots; compacted lazily.
 */
export class ActiveSet {
  readonly alive: Uint8Array;
  private list: Int32Array;
  private length: number;
  private dead = 0;

  constructor(n: number) {
    this.alive = new Uint8Array(n).fill(1);
    this.list = new Int32Array(n);
    for (let i = 0; i < n; i++) this.list[i] = i;
    this.length = n;
  }

  /** Live count. */
  get count(): number {
    return this.length - this.dead;
  }

  remove(i: number): void {
    if (!this.alive[i]) return;
    this.alive[i] = 0;
    this.dead++;
    if (this.dead * 2 > this.length) this.compact();
  }

  /** Slots to scan (may include dead ones: check `alive`), and how many of them. */
  slots(): { list: Int32Array; length: number } {
    return { list: this.list, length: this.length };
  }

  first(): number {
    for (let t = 0; t < this.length; t++) if (this.alive[this.list[t]]) return this.list[t];
    return -1;
  }

  private compact(): void {
    let w = 0;
    for (let t = 0; t < this.length; t++) {
      const i = this.list[t];
      if (this.alive[i]) this.list[w++] = i;
    }
    this.length = w;
    this.dead = 0;
  }
}
