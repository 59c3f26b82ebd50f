/**
 * End to end, browser mode: an HDBSCAN run of the demo study from the run panel. The cluster list
 * shows the same clusters and sizes as the CLI's windows.csv for the same parameters, and the
 * noise windows stand as the last cluster, set aside from the start.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../cli/run-cli';
import { tempDir } from '../temp';
import { OUTPUT, ROOT, startHarness, waitForRuns, type Harness, openAndWait } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');

describe('HDBSCAN from the run panel, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('lists the CLI\'s clusters and sizes, with the noise cluster last and set aside', async () => {
    const out = tempDir('hdbscan-cli');
    const cli = runCli(['analyze', DEMO, '--out', out, '--progress', 'none', '--cluster', 'hdbscan', '--min-cluster-size', '40']);
    expect(cli.status).toBe(0);
    const rows = readFileSync(join(out, 'windows.csv'), 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(','));
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')) as { cluster: { k: number; noiseCluster: number } };
    const { k, noiseCluster } = summary.cluster;
    // Files number clusters index + 1: the noise cluster is the last, number k.
    expect(noiseCluster).toBe(k);
    const cliSizes = Array.from({ length: k }, (_, j) => rows.filter((r) => Number(r[6]) === j + 1).length);

    const { page } = h;
    await page.goto(h.url);
    await openAndWait(page, DEMO);
    await page.locator('#param-cluster').selectOption('hdbscan');
    await expect(page.getByLabel('Clusters (k)').count()).resolves.toBe(0);
    await page.getByLabel('Min. cluster size').fill('40');
    await page.getByLabel('Min. samples').fill('40');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);

    const list = page.locator('li:has(input[aria-label^="Name of cluster"])');
    await expect(list.count()).resolves.toBe(k);
    const shownSizes = (await list.locator('.size').allTextContents()).map((t) => Number(t.replace(/[^0-9]/g, '')));
    expect(shownSizes).toEqual(cliSizes);
    const last = list.nth(k - 1);
    await expect(last.locator('.tag').textContent()).resolves.toBe('set aside');
    for (let j = 0; j < k - 1; j++) await expect(list.nth(j).locator('.tag').count()).resolves.toBe(0);
    await page.screenshot({ path: join(OUTPUT, 'hdbscan-run.png') });
    expect(h.pageErrors).toEqual([]);
  });
});
