/**
 * End to end, browser mode: while a second UMAP run computes, the live Map colours its points by
 * the previous run's curated clusters and shows their legend; the final Map continues from the
 * last live frame's view. The second run embeds a sample (Sample above 1,000), so the live points
 * are matched to windows through the partials' rows.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OUTPUT, ROOT, startWithTable, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;
const NEUTRAL = [0x56, 0x60, 0x6b];

interface View { centreX: number; centreY: number; scale: number }
interface Hook { liveFrames: number; busy: boolean; runCount: number; liveLastView: View | null; mapView: View | null }
const hook = (page: Page): Promise<Hook> =>
  page.evaluate(() => {
    const h = (window as unknown as { __gleaner: Hook }).__gleaner;
    return { liveFrames: h.liveFrames, busy: h.busy, runCount: h.runCount, liveLastView: h.liveLastView, mapView: h.mapView };
  });

/** Pixels of the live canvas by kind: white background, the neutral grey, or any other colour. */
const livePixels = (page: Page) =>
  page.evaluate((neutral) => {
    const canvas = document.querySelector<HTMLCanvasElement>('canvas[aria-label^="Map being computed"]');
    if (!canvas) return null;
    const px = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data;
    let coloured = 0, grey = 0;
    for (let i = 0; i < px.length; i += 4) {
      const [r, g, b, a] = [px[i], px[i + 1], px[i + 2], px[i + 3]];
      if (a === 0 || (r > 240 && g > 240 && b > 240)) continue;
      // Saturated (channels apart) and not the neutral colour or a blend of it with white.
      const spread = Math.max(r, g, b) - Math.min(r, g, b);
      const nearNeutral = Math.abs(r - neutral[0]) + Math.abs(g - neutral[1]) + Math.abs(b - neutral[2]) < 30;
      if (spread > 40 && !nearNeutral) coloured++;
      else grey++;
    }
    return { coloured, grey };
  }, NEUTRAL);

describe('browser mode: the live Map keeps colours and a legend', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startWithTable(DEMO, DEMO_WINDOWS);
  });
  afterAll(async () => {
    await h?.close();
  });

  it('colours the second UMAP run by the first run\'s clusters, with their legend, and hands over the view', async () => {
    const { page } = h;
    await page.getByLabel('Embedding').selectOption('umap');
    await page.getByLabel('Clusters (k)').fill('7');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    // The first run has no previous run: one colour, and the legend says why.
    await page.waitForFunction(() => (window as unknown as { __gleaner: Hook }).__gleaner.liveFrames > 0, null, { timeout: 120_000, polling: 50 });
    const firstLegend = await page.getByTestId('live-legend').textContent().catch(() => null);
    await waitForRuns(page, 1, 180_000);
    if (firstLegend !== null) expect(firstLegend).toMatch(/no previous run/);

    await page.getByLabel('Sample above').fill('1000');
    const before = await hook(page);
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    let sampled: { coloured: number; grey: number } | null = null;
    let legend: string | null = null;
    let visible = false;
    for (let t = 0; t < 2400 && !sampled; t++) {
      const s = await hook(page);
      if (s.runCount > before.runCount) break;
      if (s.liveFrames >= before.liveFrames + 2) {
        const px = await livePixels(page);
        legend = await page.getByTestId('live-legend').textContent().catch(() => null);
        visible = await page.getByTestId('live-legend').getByText('cluster of the previous run').isVisible().catch(() => false);
        if (px && legend !== null) {
          sampled = px;
          await page.screenshot({ path: join(OUTPUT, 'live-map-coloured.png') });
        }
      }
      await page.waitForTimeout(50);
    }
    expect(sampled).not.toBeNull();
    expect(sampled!.coloured).toBeGreaterThan(500);
    expect(sampled!.coloured).toBeGreaterThan(sampled!.grey);
    expect(legend).toMatch(/cluster of the previous run/);
    expect(legend).toMatch(/1.*2.*3.*4.*5.*6.*7/s);
    expect(visible).toBe(true);

    await waitForRuns(page, before.runCount + 1, 180_000);
    const after = await hook(page);
    // The final Map continues from the last live frame: the same data → screen transform.
    expect(after.liveLastView).not.toBeNull();
    expect(after.mapView).toEqual(after.liveLastView);
    expect(h.pageErrors).toEqual([]);
  });
});
