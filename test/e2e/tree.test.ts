/**
 * End to end, browser mode: a hierarchical (Ward) run of the demo study, its Tree with the
 * draggable cut and branch highlighting linked to the Map, and the k sweep whose charts set k.
 * Reads the demo study from demo-data/.
 */
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hookState, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');

interface TreeHook {
  k: number;
  clustersDrawn: number;
  highlightSize: number;
  treeBranches: number;
  sweepPoints: number;
  selectionSize: number;
  windows: number;
  runCount: number;
  clusterOf(i: number): number;
}

function hook(page: Page): Promise<Omit<TreeHook, 'clusterOf'>> {
  return page.evaluate(() => {
    const h = (window as unknown as { __gleaner: TreeHook }).__gleaner;
    return {
      k: h.k, clustersDrawn: h.clustersDrawn, highlightSize: h.highlightSize, treeBranches: h.treeBranches,
      sweepPoints: h.sweepPoints, selectionSize: h.selectionSize, windows: h.windows, runCount: h.runCount,
    };
  });
}

/** Distinct clusters among the windows' labels in the shown run. */
function distinctClusters(page: Page, n: number): Promise<number> {
  return page.evaluate((count) => {
    const h = (window as unknown as { __gleaner: TreeHook }).__gleaner;
    const seen = new Set<number>();
    for (let i = 0; i < count; i++) seen.add(h.clusterOf(i));
    return seen.size;
  }, n);
}

describe('Tree and k sweep, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('cuts a Ward tree by dragging, lights a branch on the Map, and sets k from the sweep', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction(() => (window as unknown as { __gleaner: TreeHook }).__gleaner.windows > 0, undefined, { timeout: 60_000 });
    const { windows } = await hookState(page);

    // Switch to hierarchical Ward, 4 clusters, and run.
    await page.locator('#param-cluster').selectOption('ward');
    await page.getByLabel('Clusters (k)').fill('4');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);
    let s = await hook(page);
    expect(s.k).toBe(4);
    expect(s.clustersDrawn).toBe(4);

    // Open the Tree: a summarised dendrogram (a few hundred branches at most, not one per window).
    await page.getByRole('tab', { name: 'Tree' }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: TreeHook }).__gleaner.treeBranches > 0);
    s = await hook(page);
    expect(s.treeBranches).toBeLessThan(2 * 230);
    const canvas = page.locator('canvas[data-cut-at]');
    const box = (await canvas.boundingBox())!;
    const cutY = Number(await canvas.getAttribute('data-cut-at'));
    expect(cutY).toBeGreaterThan(0);

    // Drag the cut line down (towards the leaves): more clusters, and the Map recolours live.
    const x = box.x + box.width * 0.6;
    await page.mouse.move(x, box.y + cutY);
    await page.mouse.down();
    const target = box.y + cutY + (box.height - cutY) * 0.35;
    for (let i = 1; i <= 10; i++) await page.mouse.move(x, box.y + cutY + ((target - box.y - cutY) * i) / 10);
    await page.mouse.up();
    await page.waitForFunction(() => {
      const g = (window as unknown as { __gleaner: TreeHook }).__gleaner;
      return g.k > 4 && g.clustersDrawn === Math.min(g.k, 255);
    });
    s = await hook(page);
    expect(s.k).toBeGreaterThan(4);
    expect(await distinctClusters(page, windows)).toBe(s.k);
    expect(Number(await canvas.getAttribute('data-cut-at'))).toBeGreaterThan(cutY);
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe(String(s.k));

    // Hover a branch: scan across the upper part of the tree (above the cut line, clear of its
    // grab zone) until the pointer is on one.
    const scanY = Number(await canvas.getAttribute('data-cut-at')) - 24;
    expect(scanY).toBeGreaterThan(20);
    let lit = 0;
    for (let px = 60; px < box.width - 20 && lit === 0; px += 3) {
      await page.mouse.move(box.x + px, box.y + scanY);
      lit = (await hook(page)).highlightSize;
    }
    expect(lit).toBeGreaterThan(0);
    expect(lit).toBeLessThan(windows);
    await page.screenshot({ path: join(OUTPUT, 'tree-map.png') });

    // Click the branch: its windows become the shared selection.
    await page.mouse.down();
    await page.mouse.up();
    await expect.poll(async () => (await hook(page)).selectionSize).toBe(lit);

    // The sweep: charts of the four figures over k = 2..7; clicking k = 5 re-runs with it.
    await page.getByRole('tab', { name: 'Sweep k' }).click();
    await page.getByLabel('Sweep k from').fill('2');
    await page.getByLabel('Sweep k to').fill('7');
    await page.getByRole('button', { name: 'Sweep k', exact: true }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: TreeHook }).__gleaner.sweepPoints === 4 * 6, undefined, { timeout: 120_000 });
    await page.screenshot({ path: join(OUTPUT, 'tree-sweep.png') });
    const runs = (await hook(page)).runCount;
    await page.locator('circle.hit[data-k="5"]').first().click();
    await waitForRuns(page, runs + 1);
    s = await hook(page);
    expect(s.k).toBe(5);
    expect(s.clustersDrawn).toBe(5);
    expect(await page.getByLabel('Clusters (k)').inputValue()).toBe('5');
    expect(await page.locator('#param-cluster').inputValue()).toBe('ward');
    expect(h.pageErrors).toEqual([]);
  });
});
