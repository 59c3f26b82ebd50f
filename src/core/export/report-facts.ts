import type { AnalysisResult, EmbedRecord } from '../analysis.types';
import { DEFAULT_RECIPE, type Recipe } from '../recipe/recipe.types';
import { recipeInWords } from '../recipe/step-words';
import { thousands } from './csv';
import type { ReportFact, ReportMetric } from './study-report';

export { thousands };

/** How the map was made, in words. */
export function embedInWords(embed: EmbedRecord): string {
  if (embed.method === 'pca') {
    const [a, b] = embed.explainedVarianceRatio;
    return `PCA: x = PC1 (${Math.round(a * 100)}% of variance), y = PC2 (${Math.round(b * 100)}%)`;
  }
  const how = embed.method === 'tsne'
    ? `t-SNE, perplexity ${embed.perplexity}, ${thousands(embed.iterations)} iterations`
    : `UMAP, ${embed.neighbors} neighbours, minimum distance ${embed.minDist}, ${embed.metric} distance`;
  const pre = embed.preReduced ? ` on ${embed.preReduced} principal axes` : '';
  const sampled = embed.sampling ? `; ${thousands(embed.sampling.embedded)} windows embedded, ${thousands(embed.sampling.placed)} placed from their neighbours` : '';
  return `${how}${pre}${sampled}; the axes have no units`;
}

/** How the clusters were found, in words. */
export function clusterInWords(c: AnalysisResult['cluster']): string {
  if (c.method === 'kmeans') return `k-means, k = ${c.k}, ${c.restarts} restarts (k-means++ start)`;
  if (c.method === 'hierarchical') {
    const cut = c.cutHeight !== undefined ? `cut at height ${c.cutHeight}` : `cut into ${c.k} clusters`;
    return `${c.linkage} linkage tree, ${cut}${c.path === 'two-stage' ? ', micro-clusters first' : ''}${c.space === 'map' ? ', on the map' : ''}`;
  }
  return `HDBSCAN, minimum cluster size ${c.minClusterSize}, minimum samples ${c.minSamples}: ${c.clusters} dense clusters, ${thousands(c.noise)} windows in none (set aside)`;
}

/** The provenance table of the report: what the export was made from and how. */
export function reportFacts(args: {
  input: { fileName: string; sha256: string; rows: number; features: number };
  recipe?: Recipe;
  result: AnalysisResult;
  seed: number;
  appVersion: string;
  createdAt: string;
}): ReportFact[] {
  const { input, result } = args;
  return [
    { name: 'Windows table', value: `${input.fileName}, ${thousands(input.rows)} windows, ${input.features} features` },
    { name: 'Its SHA-256', value: input.sha256 },
    { name: 'Recipe', value: recipeInWords(args.recipe ?? DEFAULT_RECIPE) },
    { name: 'Map', value: embedInWords(result.embed) },
    { name: 'Clusters', value: clusterInWords(result.cluster) },
    { name: 'Seed', value: String(args.seed) },
    { name: 'Made by', value: `Gleaner ${args.appVersion}, ${args.createdAt}` },
  ];
}

/** The run's figures for the report, rounded, each with what it says. */
export function reportMetrics(args: {
  windows: number;
  /** Clusters listed (set-aside ones included) and how many of them are set aside. */
  clusters: number;
  setAside: number;
  /** The silhouette shown on screen: the run's, or measured on the curated clusters. */
  silhouette: { value: number; sampleSize: number; curated: boolean } | null;
  embed: EmbedRecord;
}): ReportMetric[] {
  const out: ReportMetric[] = [
    { name: 'Windows', value: thousands(args.windows), meaning: 'windows analysed (after the recipe)' },
    { name: 'Clusters', value: String(args.clusters), meaning: args.setAside > 0 ? `as listed; ${args.setAside} of them set aside as noise` : 'as listed' },
  ];
  const s = args.silhouette;
  out.push({
    name: 'Mean silhouette',
    value: s && Number.isFinite(s.value) ? s.value.toFixed(2) : 'not measured',
    meaning: `−1 to 1; higher = clusters further apart and tighter${s ? ` (${s.curated ? 'the curated clusters' : 'the run\'s clusters'}, a seeded sample of ${thousands(s.sampleSize)} windows)` : ''}`,
  });
  const t = args.embed.trustworthiness;
  if (t !== undefined && Number.isFinite(t)) {
    out.push({ name: 'Map trustworthiness', value: t.toFixed(3), meaning: '0 to 1; share of the map\'s near neighbours that are near in the features too (1 = none false)' });
  }
  return out;
}
