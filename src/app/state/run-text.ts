import type { AnalysisParams, AnalysisResult } from '../../core/analysis.types';

const EMBED_NAMES = { pca: 'PCA', tsne: 't-SNE', umap: 'UMAP' } as const;

/** "UMAP and Ward tree (k = 7)" / "PCA and k-means (k = 8, 10 restarts)" for the status bar. */
export function runDescription(params: AnalysisParams): string {
  const embed = EMBED_NAMES[params.embed?.method ?? 'pca'];
  const c = params.cluster;
  const cluster = !c || c.method === 'kmeans'
    ? `k-means (k = ${c?.k ?? params.k}, ${c?.restarts ?? params.restarts} restarts)`
    : `${c.method} tree (${c.k !== undefined ? `k = ${c.k}` : `cut at ${c.cutHeight}`})`;
  return `${embed} and ${cluster}${params.space === 'map' ? ' in map space' : ''}`;
}

/** " · 12,000 windows placed" when the run sampled, else ''. */
export function placedNote(result: AnalysisResult): string {
  if (!result.placed) return '';
  let placed = 0;
  for (const v of result.placed) placed += v;
  return ` · ${placed.toLocaleString('en')} windows placed`;
}
