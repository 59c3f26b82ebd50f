export { TSNE_DEFAULTS, EXACT_MAX_N, resolveTsneOptions, learningRateOf, type TsneOptions } from './options';
export { Tsne } from './tsne';
export { runTsne, FRAME_EVERY } from './run';
export { conditionalProbabilities } from './perplexity';
export { symmetrize, type Affinities } from './affinities';
