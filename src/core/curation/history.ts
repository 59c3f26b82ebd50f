import { applyAction } from './apply-action';
import type { CurationAction, CurationState } from './curation.types';

/**
 * Undo and redo over curation states. Past states are kept whole (they share their unchanged parts,
 * so a name change costs a few bytes); `done` and `undone` keep the actions, so the study records
 * every change and can replay them. Immutable: every call returns a new History.
 */
export interface History {
  readonly past: readonly CurationState[];
  readonly present: CurationState;
  readonly future: readonly CurationState[];
  /** The actions that lead from the first past state to the present, in order. */
  readonly done: readonly CurationAction[];
  /** Actions undone (most recently undone last), redone in reverse order. */
  readonly undone: readonly CurationAction[];
}

export function createHistory(initial: CurationState): History {
  return { past: [], present: initial, future: [], done: [], undone: [] };
}

/** Applies an action; clears what could be redone. */
export function record(h: History, action: CurationAction): History {
  const next = applyAction(h.present, action);
  return { past: [...h.past, h.present], present: next, future: [], done: [...h.done, action], undone: [] };
}

export function canUndo(h: History): boolean {
  return h.past.length > 0;
}

export function canRedo(h: History): boolean {
  return h.future.length > 0;
}

export function undo(h: History): History {
  if (!canUndo(h)) return h;
  return {
    past: h.past.slice(0, -1),
    present: h.past[h.past.length - 1],
    future: [h.present, ...h.future],
    done: h.done.slice(0, -1),
    undone: [...h.undone, h.done[h.done.length - 1]],
  };
}

export function redo(h: History): History {
  if (!canRedo(h)) return h;
  return {
    past: [...h.past, h.present],
    present: h.future[0],
    future: h.future.slice(1),
    done: [...h.done, h.undone[h.undone.length - 1]],
    undone: h.undone.slice(0, -1),
  };
}

/** The state the recorded actions lead to from `initial` (for reopening a study). */
export function replay(initial: CurationState, actions: readonly CurationAction[]): CurationState {
  return actions.reduce(applyAction, initial);
}
