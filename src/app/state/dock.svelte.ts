/** Which view of the dock is open (null: the Map has the whole centre). */
export class DockState {
  view = $state<string | null>(null);

  toggle(id: string | null): void {
    this.view = id === null || this.view === id ? null : id;
  }
}
