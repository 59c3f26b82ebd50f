import type { ClusterNote } from '../curation/curation.types';
import { candidateName, clusterNumber } from '../export/run-model';

/**
 * The number and name a curated cluster goes by outside the app, by the exports' one numbering
 * (src/core/export/run-model.ts): number = index + 1; name = its class name once promoted, else
 * the user's working name, else "candidate <number>".
 */
export function clusterIdentity(index: number, note: Pick<ClusterNote, 'className' | 'name'> | undefined): { number: number; name: string } {
  return { number: clusterNumber(index), name: note?.className || note?.name || candidateName(index) };
}
