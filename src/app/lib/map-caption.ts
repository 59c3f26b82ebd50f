import type { EmbedRecord } from '../../core/analysis.types';

const pct = (r: number) => `${(r * 100).toFixed(0)}%`;

/** What the Map's axes are: PCA axes with their variance share, or the method that laid it out. */
export function axesCaption(embed: EmbedRecord): string {
  if (embed.method === 'pca') {
    return `x: PC1 (${pct(embed.explainedVarianceRatio[0])} of variance) · y: PC2 (${pct(embed.explainedVarianceRatio[1])})`;
  }
  const how = embed.method === 'tsne'
    ? `t-SNE, perplexity ${embed.perplexity}, ${embed.iterations} iterations`
    : `UMAP, ${embed.neighbors} neighbours, min. distance ${embed.minDist}, ${embed.metric}`;
  const sampled = embed.sampling ? ` · ${embed.sampling.embedded.toLocaleString('en')} windows embedded, ${embed.sampling.placed.toLocaleString('en')} placed (lighter)` : '';
  return `${how}${embed.preReduced ? ` on ${embed.preReduced} principal axes` : ''}${sampled} · axes have no units`;
}

/** "trustworthiness 0.951 · neighbours kept 41%" for the Map's corner; '' when the run has no quality figures. */
export function qualityCaption(embed: EmbedRecord): string {
  const t = embed.trustworthiness, k = embed.neighbourhoodPreservation;
  if (t === undefined || k === undefined || !Number.isFinite(t) || !Number.isFinite(k)) return '';
  return `trustworthiness ${t.toFixed(3)} · neighbours kept ${pct(k)}`;
}

/** Tooltip: how both figures are measured. */
export function qualityHint(embed: EmbedRecord): string {
  return `Measured against the scaled features on ${embed.qualitySampleSize ?? 0} windows at k = 10: trustworthiness (1 = no false neighbours in the map) and the share of each window's 10 nearest neighbours that stay among its 10 nearest in the map.`;
}
