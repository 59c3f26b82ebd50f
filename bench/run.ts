// `npm run bench [-- <suite>] [-- --quick]`: runs one suite (default "pipeline") of this project
// beside peer libraries on the same seeded data, in one process, and prints a side-by-side table.
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { stopMeasuring } from './measure';

const SUITES: Record<string, () => Promise<{ run(quick: boolean): Promise<void> }>> = {
  pipeline: () => import('./suites/pipeline'),
  load: () => import('./suites/load'),
  raw: () => import('./suites/raw'),
  embed: () => import('./suites/embed'),
  map: () => import('./suites/map'),
  cluster: () => import('./suites/cluster'),
  traces: () => import('./suites/traces'),
  cancel: () => import('./suites/cancel'),
  hdbscan: () => import('./suites/hdbscan'),
  stability: () => import('./suites/stability'),
  peers: () => import('./suites/peers'),
};

const args = process.argv.slice(2);
const quick = args.includes('--quick');
const names = args.filter((a) => !a.startsWith('--'));
const chosen = names.length ? names : ['pipeline'];
for (const name of chosen) {
  const load = SUITES[name];
  if (!load) {
    console.error(`unknown suite "${name}" (expected one of ${Object.keys(SUITES).join(', ')})`);
    process.exit(2);
  }
  await (await load()).run(quick);
}
await stopMeasuring();
// BENCHMARKS.md is generated from the rows the suites appended (scripts/benchmarks-md.mjs).
const root = resolve(import.meta.dirname, '..');
const { writeBenchmarks } = (await import(pathToFileURL(resolve(root, 'scripts/benchmarks-md.mjs')).href)) as { writeBenchmarks: (root: string) => string };
console.log(`wrote ${writeBenchmarks(root)}`);
