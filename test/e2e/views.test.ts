/**
 * End to end, browser mode: the Mix, Fingerprints, Timeline and Runs views on the demo study
 * (demo-data/windows.csv, k = 7, seed 1). The expected subject-bound flag and its removal by
 * per-subject scaling are the planted facts of the demo (DESIGN.md §5: two volunteers wear the
 * watch loosely; docs/subject-bound.md gives the measured core figures).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hookState, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const demoLines = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0);
const DEMO_WINDOWS = demoLines.length - 1;
const header = demoLines[0].split(',');
// Feature columns of the demo table: everything after the label column (demo-data generator layout).
const DEMO_FEATURES = header.length - header.indexOf('activity_label') - 1;
const DEMO_SUBJECTS = new Set(demoLines.slice(1).map((l) => l.split(',')[1])).size;

interface Views {
  mixBars: number; mixSegments: number; mixBound: number; fingerprintCells: number;
  timelineStrips: number; timelineWindows: number; contingencyCells: number; comparisonAri: number;
}
const views = (page: Page) => page.evaluate(() => (window as unknown as { __gleaner: { views: Views } }).__gleaner.views);
/** Waits until every named figure of the views equals the wanted value. */
const waitViews = (page: Page, want: Partial<Views>) => page.waitForFunction((w) => {
  const v = (window as unknown as { __gleaner: { views: Record<string, number> } }).__gleaner.views;
  return Object.entries(w).every(([key, value]) => v[key] === value);
}, want, { timeout: 60_000, polling: 100 });

describe('Mix, Fingerprints, Timeline and Runs views on the demo study', () => {
  let h: Harness;
  beforeAll(async () => { h = await startHarness(); });
  afterAll(async () => { await h?.close(); });

  it('draws each view, links the selection, and re-runs with per-subject scaling', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows === n, DEMO_WINDOWS, { timeout: 60_000 });
    await page.getByLabel('Clusters (k)').fill('7');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);

    // Mix: one bar per cluster; the loose-watch cluster is flagged subject-bound (DESIGN.md §5).
    await page.getByRole('tab', { name: 'Mix' }).click();
    await waitViews(page, { mixBars: 7 });
    let v = await views(page);
    expect(v.mixSegments).toBeGreaterThan(7);
    expect(v.mixBound).toBe(1);
    const flag = page.getByTestId('bound-flag');
    await expect(flag.textContent()).resolves.toMatch(/subject-bound.*subjects (S04, S09|S09, S04) hold/);
    await expect(page.getByTestId('label-agreement').textContent()).resolves.toMatch(/Computed on n = \d+ labelled windows of 4851/);

    // Click a segment: the selection holds exactly that segment's windows.
    const segment = page.getByTestId('mix-segment').nth(2);
    const size = Number(await segment.getAttribute('data-windows'));
    expect(size).toBeGreaterThan(0);
    await segment.click();
    await expect.poll(async () => (await hookState(page)).selectionSize).toBe(size);
    await page.screenshot({ path: join(OUTPUT, 'mix.png') });

    // Fingerprints: clusters × features cells.
    await page.getByRole('tab', { name: 'Fingerprints' }).click();
    await waitViews(page, { fingerprintCells: 7 * DEMO_FEATURES });
    await page.getByRole('button', { name: 'Select its windows' }).click();
    const firstSize = await page.evaluate(() => {
      const g = (window as unknown as { __gleaner: { clusterOf(i: number): number; windows: number } }).__gleaner;
      let n = 0;
      for (let i = 0; i < g.windows; i++) if (g.clusterOf(i) === 0) n++;
      return n;
    });
    await expect.poll(async () => (await hookState(page)).selectionSize).toBe(firstSize);
    await page.screenshot({ path: join(OUTPUT, 'fingerprints.png') });

    // Timeline: one strip per subject, every window drawn; clicking a window selects its bout.
    await page.getByRole('tab', { name: 'Timeline' }).click();
    await waitViews(page, { timelineStrips: DEMO_SUBJECTS, timelineWindows: DEMO_WINDOWS });
    const box = (await page.getByTestId('timeline').boundingBox())!;
    await page.mouse.click(box.x + 64 + 40, box.y + 22 + 8); // first strip, near its start (TL layout)
    await expect.poll(async () => (await hookState(page)).selectionSize).toBeGreaterThan(0);
    const bout = (await hookState(page)).selectionSize;
    expect(bout).toBeLessThan(DEMO_WINDOWS);
    await page.screenshot({ path: join(OUTPUT, 'timeline.png') });

    // Runs: re-run with per-subject scaling; the comparison shows the ARI; the flag is gone.
    await page.getByRole('tab', { name: 'Runs' }).click();
    // The status bar's Cancel stops the re-run too, and the shown run stays.
    await page.getByRole('button', { name: 'Re-run with per-subject scaling' }).click();
    await page.getByRole('button', { name: 'Cancel' }).click();
    await expect.poll(async () => (await page.getByTestId('status').textContent()) ?? '', { timeout: 15_000 }).toMatch(/Re-run cancelled/);
    expect((await hookState(page)).runCount).toBe(1);
    await page.getByRole('button', { name: 'Re-run with per-subject scaling' }).click();
    await waitForRuns(page, 2);
    await page.waitForFunction(() => {
      const c = (window as unknown as { __gleaner: { views: Views } }).__gleaner.views;
      return c.contingencyCells > 0 && Number.isFinite(c.comparisonAri);
    }, undefined, { timeout: 60_000, polling: 100 });
    v = await views(page);
    expect(v.comparisonAri).toBeGreaterThan(-0.5);
    expect(v.comparisonAri).toBeLessThan(1); // the partitions differ: the loose-watch cluster dissolves
    await expect(page.getByTestId('comparison-ari').textContent()).resolves.toMatch(/ARI \d\.\d{3}/);
    await page.screenshot({ path: join(OUTPUT, 'runs.png') });
    await page.getByRole('tab', { name: 'Mix' }).click();
    await waitViews(page, { mixBars: 7 });
    await page.waitForFunction(() => (window as unknown as { __gleaner: { views: Views } }).__gleaner.views.mixBound === 0, undefined, { timeout: 30_000 });
    await expect(page.getByTestId('bound-flag').count()).resolves.toBe(0);
    expect(h.pageErrors).toEqual([]);
  }, 300_000);
});
