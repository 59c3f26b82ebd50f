// The part of tsne-js 1.0.3's API the embed bench uses (the package ships no types).
declare module 'tsne-js' {
  interface TsneOptions { dim: number; perplexity: number; earlyExaggeration: number; learningRate: number; nIter: number; metric: string }
  export default class TSNE {
    constructor(options: TsneOptions);
    init(input: { data: number[][]; type: 'dense' | 'sparse' }): void;
    run(): [number, number];
    getOutput(): number[][];
  }
}
