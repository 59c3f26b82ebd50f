export { TSNE_DEFAULTS, EXACT_MAX_N, FFT_MIN_N, resolveTsneOptions, learningRateOf, repulsionOf, type TsneOptions } from './options';
export { FftRepulsion } from './fft-repulsion';
export { BarnesHutRepulsion } from './barnes-hut';
export type { Repulsion } from './repulsion.types';
export { Tsne } from './tsne';
export { runTsne, FRAME_EVERY } from './run';
export { conditionalProbabilities } from './perplexity';
export { symmetrize, type Affinities } from './affinities';
