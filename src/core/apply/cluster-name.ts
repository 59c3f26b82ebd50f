import type { ClusterNote } from '../curation/curation.types';

/**
 * The number and name a curated cluster goes by outside the app: number = index + 1; name = its
 * class name once promoted, else the user's working name, else "candidate <number>". Kept in one
 * place so it can follow the exports' own numbering when that is shared.
 */
export function clusterIdentity(index: number, note: Pick<ClusterNote, 'className' | 'name'> | undefined): { number: number; name: string } {
  const number = index + 1;
  const name = note?.className || note?.name || `candidate ${number}`;
  return { number, name };
}
