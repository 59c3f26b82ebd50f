export type { ClusterNote, CurationAction, CurationState } from './curation.types';
export { applyAction } from './apply-action';
export { classNames, clusterSizes, emptyNote, initialCuration, setAsideFlags } from './initial-state';
export { canRedo, canUndo, createHistory, record, redo, replay, undo, type History } from './history';
