/**
 * End to end, browser mode then the CLI: "Check stability" in the cluster list measures each
 * cluster's stability across subjects in the worker (20 resamples, a quarter of the subjects left
 * out), shows it in every row and in the Mix, and gives the same figures, cluster by cluster, as
 * `gleaner analyze --stability 20` writes into summary.json for the same run. Reads demo-data/.
 */
import { join } from 'node:path';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli, tempDir } from '../cli/run-cli';
import { OUTPUT, ROOT, startHarness, waitForRuns, type Harness, openAndWait } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');

describe('stability across subjects in the app', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('shows each cluster\'s stability, equal to the CLI\'s summary.json for the same run', async () => {
    const out = tempDir('stability-cli');
    const cli = runCli(['analyze', DEMO, '--out', out, '--progress', 'none', '--k', '7', '--seed', '1', '--stability', '20']);
    expect(cli.status, cli.stderr).toBe(0);
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')) as { clusters: { number: number; size: number; stability: number }[] };

    const { page } = h;
    await page.goto(h.url);
    await openAndWait(page, DEMO);
    await page.getByLabel('Clusters (k)').fill('7');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);
    // The same run as the CLI's: the same sizes by number.
    const sizes = (await page.locator('li:has(input[aria-label^="Name of cluster"]) .size').allTextContents()).map((t) => Number(t.replace(/,/g, '')));
    expect(sizes).toEqual(summary.clusters.map((c) => c.size));

    await page.getByRole('button', { name: 'Check stability' }).click();
    const cells = page.getByTestId('stability');
    await expect.poll(() => cells.count(), { timeout: 120_000 }).toBe(7);
    const shown = (await cells.evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-value')))));
    shown.forEach((v, j) => expect(v, `cluster ${j + 1}`).toBeCloseTo(summary.clusters[j].stability, 12));
    await expect(cells.first().textContent()).resolves.toMatch(/^stability \d\.\d\d/);

    await page.getByRole('tab', { name: 'Mix' }).click();
    await expect.poll(async () => (await page.getByTestId('mix-stability').textContent())?.replace(/\s+/g, ' '), { timeout: 30_000 }).toMatch(/Stability across subjects \(mean Jaccard, 20 resamples\): .*candidate 1 \d\.\d\d/);
    await page.screenshot({ path: join(OUTPUT, 'stability.png') });

    // A merge changes the clusters: the figures are withdrawn, not shown for other clusters.
    await page.getByLabel('Select cluster 1').check();
    await page.getByLabel('Select cluster 2').check();
    await page.getByRole('button', { name: 'Merge 2 ticked' }).click();
    await expect.poll(() => cells.count()).toBe(0);
    await expect(page.getByTestId('stability-stale').count()).resolves.toBe(1);
    expect(h.pageErrors).toEqual([]);
  }, 300_000);
});
