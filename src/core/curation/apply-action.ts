import { OptionError } from '../errors';
import { emptyNote } from './initial-state';
import type { ClusterNote, CurationAction, CurationState } from './curation.types';

const COLOUR = /^#[0-9a-f]{6}$/i;

/**
 * The state after one curation action. Pure: `state` is never changed; unchanged parts (the labels
 * array, untouched cluster notes) are shared with the result. Throws OptionError for an action that
 * does not fit the state (a cluster index out of range, a split whose parts do not match the cluster).
 */
export function applyAction(state: CurationState, action: CurationAction): CurationState {
  switch (action.type) {
    case 'name':
      return note(state, action.cluster, { name: text(action.name, 'name') });
    case 'colour':
      if (action.colour !== '' && !COLOUR.test(action.colour)) throw new OptionError('colour', action.colour, 'a colour "#rrggbb" or "" for the palette colour');
      return note(state, action.cluster, { colour: action.colour.toLowerCase() });
    case 'describe':
      return note(state, action.cluster, { description: text(action.description, 'description') });
    case 'set-aside':
      return note(state, action.cluster, { setAside: action.value === true });
    case 'promote': {
      const className = text(action.className, 'className').trim();
      if (className === '') throw new OptionError('className', action.className, 'a non-empty class name');
      return note(state, action.cluster, { className });
    }
    case 'merge':
      return merge(state, action.into, action.from);
    case 'split':
      return split(state, action.cluster, action.k, action.parts);
    case 'move':
      return move(state, action.windows, action.to);
    default:
      throw new OptionError('action', action, 'one of name, colour, describe, merge, split, set-aside, move, promote');
  }
}

function text(value: unknown, name: string): string {
  if (typeof value !== 'string') throw new OptionError(name, value, 'text');
  return value;
}

function checkCluster(state: CurationState, c: number, name = 'cluster'): void {
  if (!Number.isInteger(c) || c < 0 || c >= state.clusters.length) {
    throw new OptionError(name, c, `a cluster index from 0 to ${state.clusters.length - 1}`);
  }
}

function note(state: CurationState, c: number, change: Partial<ClusterNote>): CurationState {
  checkCluster(state, c);
  const clusters = state.clusters.slice();
  clusters[c] = { ...clusters[c], ...change };
  return { labels: state.labels, clusters };
}

function merge(state: CurationState, into: number, from: number[]): CurationState {
  checkCluster(state, into, 'into');
  if (!Array.isArray(from) || from.length === 0) throw new OptionError('from', from, 'at least one cluster to merge');
  const gone = new Set<number>();
  for (const c of from) {
    checkCluster(state, c, 'from');
    if (c === into) throw new OptionError('from', c, `clusters other than the target ${into}`);
    gone.add(c);
  }
  const labels = state.labels.slice();
  for (let i = 0; i < labels.length; i++) if (gone.has(labels[i])) labels[i] = into;
  const clusters = state.clusters.slice();
  for (const c of gone) clusters[c] = { ...clusters[c], mergedInto: into };
  return { labels, clusters };
}

function split(state: CurationState, c: number, k: number, parts: Int32Array): CurationState {
  checkCluster(state, c);
  if (!Number.isInteger(k) || k < 2) throw new OptionError('k', k, 'an integer of at least 2');
  let size = 0;
  for (let i = 0; i < state.labels.length; i++) if (state.labels[i] === c) size++;
  if (!(parts instanceof Int32Array) || parts.length !== size) {
    throw new OptionError('parts', parts?.length, `one part index per window of cluster ${c} (${size})`);
  }
  // More parts than the run has windows cannot be filled (and a damaged k of 2^31 would exhaust memory).
  if (k > state.labels.length) throw new OptionError('k', k, `at most the ${state.labels.length} windows of the run`);
  const labels = state.labels.slice();
  const base = state.clusters.length;
  let j = 0;
  for (let i = 0; i < labels.length; i++) {
    if (labels[i] !== c) continue;
    const p = parts[j++];
    if (!(Number.isInteger(p) && p >= 0 && p < k)) throw new OptionError('parts', p, `part indices from 0 to ${k - 1}`);
    if (p > 0) labels[i] = base + p - 1;
  }
  const clusters = state.clusters.concat(Array.from({ length: k - 1 }, emptyNote));
  return { labels, clusters };
}

function move(state: CurationState, windows: Int32Array, to: number): CurationState {
  const fresh = to === state.clusters.length;
  if (!fresh) checkCluster(state, to, 'to');
  if (!(windows instanceof Int32Array) || windows.length === 0) throw new OptionError('windows', windows?.length, 'at least one window index');
  const labels = state.labels.slice();
  for (const w of windows) {
    if (!(w >= 0 && w < labels.length)) throw new OptionError('windows', w, `window indices from 0 to ${labels.length - 1}`);
    labels[w] = to;
  }
  return { labels, clusters: fresh ? state.clusters.concat([emptyNote()]) : state.clusters };
}
