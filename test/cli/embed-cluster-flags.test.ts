import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseArgs } from '../../src/cli/args';
import { DEFAULT_ANALYSIS_PARAMS } from '../../src/core/analysis.types';
import { runParams } from '../../src/core/params';
import { hasStackTrace, ROOT, runCli, tempDir } from './run-cli';

/** Every 16th window of the demo study (304 windows, all 12 subjects): small enough for fast t-SNE and UMAP runs. */
let input = '';
beforeAll(() => {
  const lines = readFileSync(join(ROOT, 'demo-data/windows.csv'), 'utf8').trimEnd().split('\n');
  input = join(tempDir('small'), 'small.csv');
  writeFileSync(input, `${lines.filter((_, i) => i === 0 || i % 16 === 1).join('\n')}\n`);
});

interface Summary {
  embed: Record<string, number | string | null> & { trustworthiness: number; neighbourhoodPreservation: number };
  cluster: Record<string, unknown> & { k: number };
}

function run(args: string[]): { summary: Summary; rows: string[][] } {
  const out = tempDir('flags');
  const r = runCli(['analyze', input, '--progress', 'none', '--out', out, ...args]);
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
  const rows = readFileSync(join(out, 'windows.csv'), 'utf8').trimEnd().split('\n').map((l) => l.split(','));
  return { summary: JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')), rows };
}

describe('gleaner analyze: embedding and clustering flags', () => {
  it('parses the flags into choices and leaves a default command line without them', () => {
    const c = parseArgs(['analyze', 'x.csv', '--out', 'o', '--embed', 'umap', '--neighbors', '12', '--min-dist', '0.3', '--metric', 'cosine', '--sample-above', '500', '--cluster', 'complete', '--cut-height', '2.5', '--space', 'map']);
    if (c.command !== 'analyze') throw new Error('expected analyze');
    expect(runParams(c.values)).toMatchObject({
      embed: { method: 'umap', neighbors: 12, minDist: 0.3, metric: 'cosine' }, sampleAbove: 500, cluster: { method: 'complete', cutHeight: 2.5 }, space: 'map',
    });
    const d = parseArgs(['analyze', 'x.csv', '--out', 'o']);
    if (d.command !== 'analyze') throw new Error('expected analyze');
    expect(runParams(d.values)).toEqual(DEFAULT_ANALYSIS_PARAMS);
  });

  it('--embed pca --cluster kmeans --space features writes the same bytes as the default run', () => {
    const a = tempDir('defaults'), b = tempDir('explicit');
    expect(runCli(['analyze', input, '--k', '4', '--progress', 'none', '--out', a]).status).toBe(0);
    expect(runCli(['analyze', input, '--k', '4', '--progress', 'none', '--out', b, '--embed', 'pca', '--cluster', 'kmeans', '--space', 'features']).status).toBe(0);
    for (const f of ['windows.csv', 'summary.json']) expect(readFileSync(join(b, f)).equals(readFileSync(join(a, f)))).toBe(true);
    expect(readFileSync(join(a, 'windows.csv'), 'utf8').split('\n')[0]).toBe('id,subject,start,end,x,y,cluster,cluster_name,confidence');
  });

  it('--embed tsne --perplexity --iterations: the parameters and the map quality land in summary.json', () => {
    const { summary, rows } = run(['--embed', 'tsne', '--perplexity', '20', '--iterations', '250', '--k', '5']);
    expect(summary.embed).toMatchObject({ method: 'tsne', perplexity: 20, iterations: 250, preReduced: null, sampleSize: 304, qualitySampleSize: 304 });
    // Trustworthiness lies in [0, 1]; a t-SNE map of clustered data scores well above a random map's ≈ 0.5 (common practice).
    expect(summary.embed.trustworthiness).toBeGreaterThan(0.8);
    expect(summary.embed.trustworthiness).toBeLessThanOrEqual(1);
    expect(summary.embed.neighbourhoodPreservation).toBeGreaterThan(10 / 304);
    expect(rows[0]).toEqual(['id', 'subject', 'start', 'end', 'x', 'y', 'cluster', 'cluster_name', 'confidence']);
    expect(rows).toHaveLength(305);
  });

  it('--embed umap with --sample-above: a placed column (1 for placed windows) and the sampling in summary.json', () => {
    const { summary, rows } = run(['--embed', 'umap', '--neighbors', '10', '--min-dist', '0.2', '--metric', 'cosine', '--sample-above', '150']);
    expect(summary.embed).toMatchObject({ method: 'umap', neighbors: 10, minDist: 0.2, metric: 'cosine', sampleSize: 150, sampling: { threshold: 150, embedded: 150, placed: 154, stratifiedBy: 'subject' } });
    expect(rows[0][9]).toBe('placed');
    const placed = rows.slice(1).map((r) => r[9]);
    expect(new Set(placed)).toEqual(new Set(['0', '1']));
    expect(placed.filter((v) => v === '1')).toHaveLength(154);
  });

  it('--cluster ward --k with --space map, and --cluster average --cut-height', () => {
    const ward = run(['--cluster', 'ward', '--k', '4', '--space', 'map']);
    expect(ward.summary.cluster).toMatchObject({ method: 'hierarchical', linkage: 'ward', k: 4, path: 'exact', space: 'map', seed: 1 });
    expect(new Set(ward.rows.slice(1).map((r) => r[6])).size).toBe(4);
    const cut = run(['--cluster', 'average', '--cut-height', '7']);
    expect(cut.summary.cluster).toMatchObject({ method: 'hierarchical', linkage: 'average', cutHeight: 7, space: 'features' });
    expect(new Set(cut.rows.slice(1).map((r) => r[6])).size).toBe(cut.summary.cluster.k);
  });

  it('--cluster hdbscan --min-cluster-size: dense clusters by size, noise last with a noise column, the record in summary.json', () => {
    const { summary, rows } = run(['--cluster', 'hdbscan', '--min-cluster-size', '10']);
    const c = summary.cluster as { method: string; k: number; clusters: number; noise: number; noiseCluster: number | null; stability: number[]; minSamples: number };
    expect(c.method).toBe('hdbscan');
    expect(c.minSamples).toBe(10);
    expect(rows[0]).toEqual(['id', 'subject', 'start', 'end', 'x', 'y', 'cluster', 'cluster_name', 'confidence', 'noise']);
    const body = rows.slice(1);
    const noise = body.filter((r) => r[9] === '1');
    expect(noise).toHaveLength(c.noise);
    expect(c.noise).toBeGreaterThan(0);
    // Clusters are written by number (index + 1): the noise cluster is the last, number k.
    expect(c.noiseCluster).toBe(c.clusters + 1);
    expect(c.k).toBe(c.clusters + 1);
    expect(noise.every((r) => Number(r[6]) === c.noiseCluster && Number(r[8]) === 0)).toBe(true);
    // Dense clusters are numbered by size, largest first; each has a positive stability.
    const sizes = Array.from({ length: c.clusters }, (_, j) => body.filter((r) => Number(r[6]) === j + 1).length);
    expect(sizes.every((s, j) => s >= 10 && (j === 0 || s <= sizes[j - 1]))).toBe(true);
    expect(c.stability).toHaveLength(c.clusters);
    expect(c.stability.every((s) => s > 0)).toBe(true);
  });

  it.each([
    [['--embed', 'lle'], /invalid --embed: "lle" \(expected one of pca, tsne, umap\)/],
    [['--perplexity', '30'], /no --perplexity without --embed tsne/],
    [['--embed', 'umap', '--neighbors', '1'], /invalid --neighbors: "1" \(expected an integer >= 2\)/],
    [['--embed', 'umap', '--min-dist', '-1'], /invalid --min-dist/],
    [['--embed', 'umap', '--metric', 'manhattan'], /expected one of euclidean, cosine/],
    [['--embed', 'tsne', '--sample-above', '10'], /invalid --sample-above: "10" \(expected an integer >= 100\)/],
    [['--cluster', 'centroid'], /expected one of kmeans, ward, average, complete, single, hdbscan/],
    [['--min-cluster-size', '5'], /no --min-cluster-size without --cluster hdbscan/],
    [['--cluster', 'hdbscan', '--min-cluster-size', '1'], /invalid --min-cluster-size: "1" \(expected an integer >= 2\)/],
    [['--cluster', 'hdbscan', '--k', '4'], /no --k with hdbscan/],
    [['--cluster', 'hdbscan', '--restarts', '4'], /no --restarts with hdbscan/],
    [['--cut-height', '2'], /no --cut-height without --cluster/],
    [['--cluster', 'ward', '--k', '3', '--cut-height', '2'], /either --k or --cut-height/],
    [['--cluster', 'ward', '--restarts', '3'], /no --restarts with a tree/],
    [['--space', 'pca'], /expected one of features, map/],
  ])('rejects %j while parsing the command line', (args, message) => {
    expect(() => parseArgs(['analyze', 'x.csv', '--out', 'o', ...args])).toThrow(message);
  });

  it.each([
    [['--embed', 'lle'], /^gleaner: invalid --embed: "lle"/],
    [['--embed', 'tsne', '--perplexity', '400'], /less than the number of windows embedded \(304\)/],
  ])('the CLI reports %j in one line with exit 2', (args, message) => {
    const r = runCli(['analyze', input, '--out', tempDir('bad'), ...args]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(hasStackTrace(r.stderr)).toBe(false);
  });
});
