/**
 * Remembers every file opened as input so that no save can write over one (the app never modifies
 * input data). Paths are compared after resolving, and without case where the file system usually
 * ignores it (Windows, macOS). Node only (node:path), no electron.
 */
import { resolve } from 'node:path';

export class InputGuard {
  readonly #opened = new Set<string>();
  readonly #caseInsensitive: boolean;

  constructor(platform: string) {
    this.#caseInsensitive = platform === 'win32' || platform === 'darwin';
  }

  #key(path: string): string {
    const full = resolve(path);
    return this.#caseInsensitive ? full.toLowerCase() : full;
  }

  /** Records a path (give the real path, links resolved, where it exists). */
  remember(path: string): void {
    this.#opened.add(this.#key(path));
  }

  isInput(path: string): boolean {
    return this.#opened.has(this.#key(path));
  }

  /** The first of `paths` that was opened as input, or null. */
  firstInput(paths: readonly string[]): string | null {
    return paths.find((p) => this.isInput(p)) ?? null;
  }
}
