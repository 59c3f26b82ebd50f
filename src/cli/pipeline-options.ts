import type { AnalysisParams } from '../core/analysis.types';
import { OptionError } from '../core/errors';
import { checkRunFits, PARAMS, runParams, type ParamSpec, type RunValues } from '../core/params';
import { value, type ParsedCommand } from './parse-command';

type PipelineValues = Omit<RunValues, 'k' | 'seed' | 'restarts'>;

/**
 * The map and cluster flags of `analyze` as run values, cross-checked (a t-SNE flag needs
 * --embed tsne, --cut-height a tree, ...); throws OptionError (exit 2) naming the flag.
 */
export function pipelineValues(parsed: ParsedCommand): PipelineValues {
  const P = PARAMS;
  const { texts } = parsed;
  const embed = value(parsed, P.embed);
  only(parsed, [P.perplexity, P.iterations], embed === 'tsne', '--embed tsne');
  only(parsed, [P.neighbors, P.minDist, P.metric], embed === 'umap', '--embed umap');
  only(parsed, [P.sampleAbove], embed !== 'pca', '--embed tsne or umap');
  const out: PipelineValues = {
    embed,
    perplexity: value(parsed, P.perplexity),
    iterations: value(parsed, P.iterations),
    neighbors: value(parsed, P.neighbors),
    minDist: value(parsed, P.minDist),
    metric: value(parsed, P.metric),
    cluster: P.cluster.default,
    space: P.space.default,
    minClusterSize: value(parsed, P.minClusterSize),
  };
  if (texts.has(P.sampleAbove.flag)) out.sampleAbove = value(parsed, P.sampleAbove);
  out.cluster = value(parsed, P.cluster);
  const density = out.cluster === 'hdbscan';
  const tree = out.cluster !== 'kmeans' && !density;
  only(parsed, [P.cutHeight], tree, '--cluster ward, average, complete or single');
  only(parsed, [P.minClusterSize, P.minSamples], density, '--cluster hdbscan');
  if (texts.has(P.minSamples.flag)) out.minSamples = value(parsed, P.minSamples);
  const restarts = texts.get(P.restarts.flag);
  if (tree && restarts !== undefined) throw new OptionError('--restarts', restarts, 'no --restarts with a tree (they apply to --cluster kmeans)');
  if (density && restarts !== undefined) throw new OptionError('--restarts', restarts, 'no --restarts with hdbscan (they apply to --cluster kmeans)');
  const k = texts.get(P.k.flag);
  if (density && k !== undefined) throw new OptionError('--k', k, 'no --k with hdbscan (it finds the number of clusters itself)');
  const cut = texts.get(P.cutHeight.flag);
  if (cut !== undefined) {
    if (texts.has(P.k.flag)) throw new OptionError('--cut-height', cut, 'either --k or --cut-height, not both');
    out.cutHeight = value(parsed, P.cutHeight);
  }
  out.space = value(parsed, P.space);
  return out;
}

function only(parsed: ParsedCommand, specs: ParamSpec[], allowed: boolean, needs: string): void {
  if (allowed) return;
  for (const s of specs) {
    const text = parsed.texts.get(s.flag);
    if (text !== undefined) throw new OptionError(`--${s.flag}`, text, `no --${s.flag} without ${needs}`);
  }
}

/** The run's parameters from the flags, checked against the study's size (n windows) before the long run. */
export function analyzeParams(values: RunValues, n: number): AnalysisParams {
  const params = runParams(values);
  checkRunFits(params, n, (name) => `--${PARAMS[name].flag}`);
  return params;
}
