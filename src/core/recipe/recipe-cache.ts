import type { FeatureMatrix, RecipeStepRecord } from '../analysis.types';
import type { RecipeStep } from './recipe.types';
import type { RecipeState } from './state';

interface Entry {
  state: RecipeState;
  record: RecipeStepRecord;
}

/**
 * Results of recipe prefixes for one input matrix, keyed by the JSON of the steps up to and
 * including each one. Binding another matrix (or other subject codes) empties it. Cached states
 * are never modified: applyRecipe hands each step a copy.
 */
export class RecipeCache {
  private matrix: FeatureMatrix | null = null;
  private subjects: Int32Array | undefined;
  private entries = new Map<string, Entry>();

  /** Empties the cache unless it already holds results for this exact matrix and subject codes. */
  bind(matrix: FeatureMatrix, subjects: Int32Array | undefined): void {
    if (this.matrix === matrix && this.subjects === subjects) return;
    this.matrix = matrix;
    this.subjects = subjects;
    this.entries.clear();
  }

  /** The longest cached prefix of `steps`: its length, final state and the records up to it. */
  longestPrefix(steps: readonly RecipeStep[]): { length: number; state?: RecipeState; records: RecipeStepRecord[] } {
    const records: RecipeStepRecord[] = [];
    let state: RecipeState | undefined;
    let length = 0;
    for (let i = 0; i < steps.length; i++) {
      const e = this.entries.get(key(steps, i + 1));
      if (!e) break;
      records.push(e.record);
      state = e.state;
      length = i + 1;
    }
    return { length, state, records };
  }

  store(prefix: readonly RecipeStep[], state: RecipeState, record: RecipeStepRecord): void {
    this.entries.set(key(prefix, prefix.length), { state, record });
  }

  /** Drops entries that are not prefixes of `steps`, so the cache holds at most one result per step. */
  keepOnly(steps: readonly RecipeStep[]): void {
    const wanted = new Set(steps.map((_, i) => key(steps, i + 1)));
    for (const k of [...this.entries.keys()]) if (!wanted.has(k)) this.entries.delete(k);
  }

  get size(): number {
    return this.entries.size;
  }
}

function key(steps: readonly RecipeStep[], length: number): string {
  return JSON.stringify(steps.slice(0, length));
}
