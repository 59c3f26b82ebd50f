/**
 * End to end, browser mode: a UMAP run on the demo study redraws the Map live from the worker's
 * partial layouts while the status bar counts epochs, then shows the final Map with its quality
 * figure; a t-SNE run can be cancelled and the previous Map stays.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hookState, OUTPUT, ROOT, startWithTable, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;

interface LiveHook { partials: number; liveFrames: number; busy: boolean; runCount: number }
const live = (page: Page): Promise<LiveHook> =>
  page.evaluate(() => {
    const h = (window as unknown as { __gleaner: LiveHook }).__gleaner;
    return { partials: h.partials, liveFrames: h.liveFrames, busy: h.busy, runCount: h.runCount };
  });

describe('browser mode: t-SNE and UMAP runs', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startWithTable(DEMO, DEMO_WINDOWS);
  });
  afterAll(async () => {
    await h?.close();
  });

  it('runs UMAP with a live Map and epoch counter, then shows the Map with its quality figure', async () => {
    const { page } = h;
    await page.getByLabel('Embedding').selectOption('umap');
    await page.getByLabel('Clusters (k)').fill('7');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: LiveHook }).__gleaner.busy, null, { timeout: 10_000 });

    // Watch the status while the run lasts: the stage text changes (epochs counting up), and the
    // Map is redrawn from partial layouts.
    const texts = new Set<string>();
    let midShot = false;
    for (let t = 0; t < 1200; t++) {
      const s = await live(page);
      if (!s.busy && s.runCount >= 1) break;
      const stage = await page.getByTestId('status-stage').textContent().catch(() => null);
      if (stage) texts.add(stage);
      if (!midShot && s.liveFrames >= 3) {
        await page.screenshot({ path: join(OUTPUT, 'embed-live.png') });
        midShot = true;
      }
      await page.waitForTimeout(100);
    }
    await waitForRuns(page, 1, 180_000);
    const epochs = [...texts].filter((t) => /epoch \d+ \/ 500/.test(t));
    expect(epochs.length).toBeGreaterThanOrEqual(3);
    expect([...texts].some((t) => /elapsed/.test(t))).toBe(true);
    const after = await live(page);
    expect(after.partials).toBeGreaterThanOrEqual(3);
    expect(after.liveFrames).toBeGreaterThanOrEqual(3);
    expect(midShot).toBe(true);

    const s = await hookState(page);
    expect(s.pointsDrawn).toBe(DEMO_WINDOWS);
    expect(s.clustersDrawn).toBe(7);
    const quality = await page.getByTestId('map-quality').textContent();
    const m = /trustworthiness (\d\.\d{3}) · neighbours kept (\d+)%/.exec(quality ?? '');
    expect(m).not.toBeNull();
    // Trustworthiness lies in [0, 1] and a random map scores about 0.5 (common practice); UMAP of
    // the demo's well-separated activities scores far above that.
    expect(Number(m![1])).toBeGreaterThan(0.85);
    expect(Number(m![1])).toBeLessThanOrEqual(1);
    expect(Number(m![2])).toBeGreaterThan(10);
    await expect(page.locator('.axes').textContent()).resolves.toMatch(/^UMAP, 15 neighbours/);
    await page.screenshot({ path: join(OUTPUT, 'embed-umap.png') });
    expect(h.pageErrors).toEqual([]);
  });

  it('cancels a running t-SNE promptly and keeps the previous Map', async () => {
    const { page } = h;
    await page.getByLabel('Embedding').selectOption('tsne');
    const before = await live(page);
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await page.waitForFunction((p) => (window as unknown as { __gleaner: LiveHook }).__gleaner.partials > p, before.partials, { timeout: 120_000, polling: 50 });
    await page.getByRole('button', { name: 'Cancel' }).click();
    // Generous bound for a loaded test machine; the worker itself stops within one iteration.
    await page.waitForFunction(() => !(window as unknown as { __gleaner: LiveHook }).__gleaner.busy, null, { timeout: 3_000, polling: 20 });
    await expect(page.getByTestId('status').textContent()).resolves.toMatch(/Run cancelled\. The previous map is kept\./);
    const s = await hookState(page);
    expect(s.runCount).toBe(before.runCount);
    expect(s.pointsDrawn).toBe(DEMO_WINDOWS);
    await expect(page.locator('.axes').textContent()).resolves.toMatch(/^UMAP/);
    expect(h.pageErrors).toEqual([]);
  });

  it('samples then places above the threshold: placed windows are counted and drawn lighter', async () => {
    const { page } = h;
    await page.getByLabel('Embedding').selectOption('umap');
    await page.getByLabel('Sample above').fill('1000');
    const before = await live(page);
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, before.runCount + 1, 180_000);
    await expect(page.getByTestId('status').textContent()).resolves.toMatch(/· 3,851 windows placed$/);
    await expect(page.locator('.axes').textContent()).resolves.toMatch(/1,000 windows embedded, 3,851 placed \(lighter\)/);
    const s = await hookState(page);
    expect(s.pointsDrawn).toBe(DEMO_WINDOWS);
    await page.screenshot({ path: join(OUTPUT, 'embed-placed.png') });
    expect(h.pageErrors).toEqual([]);
  });
});
