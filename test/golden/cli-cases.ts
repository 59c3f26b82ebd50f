/**
 * The command-line golden cases: each runs the CLI on the demo windows (or the demo study) and
 * keeps what it wrote and printed. `out` is the case's output folder, `dir` a temporary folder
 * holding copies of the inputs. Masked: the temporary folder's path in printed lines (it differs
 * every run) and the export time of `gleaner run`'s provenance (the wall clock).
 */
export interface CliCase {
  name: string;
  args: (p: { demo: string; study: string; recipe: string; out: string }) => string[];
  /** Exit code expected. */
  status?: number;
}

const A = (extra: string[]) => (p: { demo: string; out: string }) => ['analyze', p.demo, '--out', p.out, '--progress', 'none', ...extra];

export const CLI_CASES: CliCase[] = [
  { name: 'analyze-default', args: A([]) },
  { name: 'analyze-kmeans-k7-seed3', args: A(['--k', '7', '--seed', '3', '--restarts', '4']) },
  { name: 'analyze-ward', args: A(['--cluster', 'ward', '--k', '7']) },
  { name: 'analyze-average-cut-map', args: A(['--cluster', 'average', '--cut-height', '1.5', '--space', 'map']) },
  { name: 'analyze-umap', args: A(['--embed', 'umap', '--neighbors', '12', '--min-dist', '0.2', '--metric', 'cosine', '--k', '6']) },
  { name: 'analyze-tsne', args: A(['--embed', 'tsne', '--perplexity', '20', '--iterations', '60', '--k', '6']) },
  { name: 'analyze-umap-sampled', args: A(['--embed', 'umap', '--sample-above', '800', '--k', '5', '--space', 'map']) },
  { name: 'analyze-events', args: A(['--k', '6', '--events']) },
  { name: 'analyze-compose', args: A(['--compose', 'device,placement', '--k', '6']) },
  { name: 'analyze-recipe-file', args: (p) => ['analyze', p.demo, '--out', p.out, '--progress', 'none', '--recipe', p.recipe, '--k', '6'] },
  { name: 'analyze-scale-impute-subject', args: A(['--scale', 'subject-zscore', '--impute', 'subject-median', '--subject', 'subject', '--k', '5']) },
  { name: 'analyze-robust-drop', args: A(['--scale=robust', '--impute=drop', '--k=4']) },
  { name: 'analyze-stability', args: A(['--k', '7', '--stability', '3']) },
  { name: 'sweep-text', args: (p) => ['sweep', p.demo, '--k-min', '2', '--k-max', '6', '--progress', 'none'] },
  { name: 'sweep-json', args: (p) => ['sweep', p.demo, '--k-min', '3', '--k-max', '5', '--seed', '2', '--restarts', '3', '--silhouette-sample', '500', '--json', '--progress', 'none'] },
  { name: 'run-study', args: (p) => ['run', p.study, '--out', p.out, '--progress', 'none'] },
  { name: 'run-study-one-run', args: (p) => ['run', p.study, '--out', p.out, '--run', 'run-1', '--input', p.demo, '--progress', 'none'] },
  // The demo study (curated) applied to the demo windows: labels and manifest, byte for byte.
  { name: 'apply-study', args: (p) => ['apply', p.study, p.demo, '--study-input', p.demo, '--out', p.out, '--progress', 'none'] },
  { name: 'error-apply-no-input', args: (p) => ['apply', p.study, '--out', p.out], status: 2 },
  // What the command line prints for help and for mistakes (exit 2), and for a bad input (exit 1).
  { name: 'help-analyze', args: () => ['--help'] },
  { name: 'help-sweep', args: () => ['sweep', '--help'] },
  { name: 'help-run', args: () => ['run', '--help'] },
  { name: 'help-inspect', args: () => ['inspect', '--help'] },
  { name: 'help-apply', args: () => ['apply', '--help'] },
  { name: 'version', args: () => ['--version'] },
  { name: 'error-no-command', args: () => [], status: 2 },
  { name: 'error-unknown-command', args: () => ['cluster', 'x.csv'], status: 2 },
  { name: 'error-unknown-flag', args: (p) => ['analyze', p.demo, '--out', p.out, '--kk', '3'], status: 2 },
  { name: 'error-single-dash', args: (p) => ['analyze', p.demo, '--out', p.out, '-k', '3'], status: 2 },
  { name: 'error-twice', args: (p) => ['analyze', p.demo, '--out', p.out, '--k', '3', '--k', '4'], status: 2 },
  { name: 'error-no-value', args: (p) => ['analyze', p.demo, '--out', p.out, '--k'], status: 2 },
  { name: 'error-no-value-before-flag', args: (p) => ['analyze', p.demo, '--k', '--out', p.out], status: 2 },
  { name: 'error-empty-value', args: (p) => ['analyze', p.demo, '--out', p.out, '--k='], status: 2 },
  { name: 'error-negative-k', args: (p) => ['analyze', p.demo, '--out', p.out, '--k', '-3'], status: 2 },
  { name: 'error-k-1', args: (p) => ['analyze', p.demo, '--out', p.out, '--k', '1'], status: 2 },
  { name: 'error-seed-big', args: (p) => ['analyze', p.demo, '--out', p.out, '--seed', '4294967296'], status: 2 },
  { name: 'error-no-out', args: (p) => ['analyze', p.demo], status: 2 },
  { name: 'error-two-inputs', args: (p) => ['analyze', p.demo, p.demo, '--out', p.out], status: 2 },
  { name: 'error-perplexity-zero', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'tsne', '--perplexity', '0'], status: 2 },
  { name: 'error-perplexity-text', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'tsne', '--perplexity', 'many'], status: 2 },
  { name: 'error-perplexity-without-tsne', args: (p) => ['analyze', p.demo, '--out', p.out, '--perplexity', '20'], status: 2 },
  { name: 'error-perplexity-too-big', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'tsne', '--perplexity', '900', '--sample-above', '900'], status: 2 },
  { name: 'error-neighbors-too-big', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'umap', '--neighbors', '500', '--sample-above', '500'], status: 2 },
  { name: 'error-min-dist', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'umap', '--min-dist', '-1'], status: 2 },
  { name: 'error-embed', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'mds'], status: 2 },
  { name: 'error-restarts-tree', args: (p) => ['analyze', p.demo, '--out', p.out, '--cluster', 'ward', '--restarts', '3'], status: 2 },
  { name: 'error-k-and-cut', args: (p) => ['analyze', p.demo, '--out', p.out, '--cluster', 'ward', '--k', '3', '--cut-height', '2'], status: 2 },
  { name: 'error-cut-kmeans', args: (p) => ['analyze', p.demo, '--out', p.out, '--cut-height', '2'], status: 2 },
  { name: 'error-sample-above', args: (p) => ['analyze', p.demo, '--out', p.out, '--embed', 'umap', '--sample-above', '50'], status: 2 },
  { name: 'error-recipe-and-scale', args: (p) => ['analyze', p.demo, '--out', p.out, '--recipe', p.recipe, '--scale', 'minmax'], status: 2 },
  { name: 'error-scale', args: (p) => ['analyze', p.demo, '--out', p.out, '--scale', 'log'], status: 2 },
  { name: 'error-compose-empty', args: (p) => ['analyze', p.demo, '--out', p.out, '--compose', 'device,,site'], status: 2 },
  { name: 'error-progress', args: (p) => ['analyze', p.demo, '--out', p.out, '--progress', 'loud'], status: 2 },
  { name: 'error-k-above-n', args: (p) => ['analyze', p.demo, '--out', p.out, '--k', '999999'], status: 2 },
  { name: 'error-stability-zero', args: (p) => ['analyze', p.demo, '--out', p.out, '--stability', '0'], status: 2 },
  { name: 'error-missing-file', args: (p) => ['analyze', `${p.out}-missing.csv`, '--out', p.out], status: 1 },
  { name: 'error-sweep-flag', args: (p) => ['sweep', p.demo, '--k', '3'], status: 2 },
  { name: 'error-sweep-kmax', args: (p) => ['sweep', p.demo, '--k-min', '5', '--k-max', '4'], status: 2 },
  { name: 'error-sweep-kmax-n', args: (p) => ['sweep', p.demo, '--k-max', '999999', '--progress', 'none'], status: 2 },
  { name: 'error-sweep-input', args: () => ['sweep'], status: 2 },
  { name: 'error-run-flag', args: (p) => ['run', p.study, '--out', p.out, '--k', '3'], status: 2 },
  { name: 'error-run-no-out', args: (p) => ['run', p.study], status: 2 },
  { name: 'error-run-unknown-run', args: (p) => ['run', p.study, '--out', p.out, '--run', 'run-9', '--progress', 'none'], status: 2 },
  { name: 'error-run-progress', args: (p) => ['run', p.study, '--out', p.out, '--progress', 'x'], status: 2 },
  { name: 'error-inspect-flag', args: () => ['inspect', '--all', 'x'], status: 2 },
  { name: 'error-inspect-two', args: () => ['inspect', 'a', 'b'], status: 2 },
];
