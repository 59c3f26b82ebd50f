/**
 * End to end, browser mode: exact Ward on 20,000 windows × 40 features in the app. Writes a seeded
 * table of Gaussian blobs to a temporary folder, opens it through the file chooser, chooses Ward
 * and runs; while the worker computes, the progress must move and the UI must answer (an
 * animation frame comes, the About dialog opens and closes). The run must finish with k clusters
 * drawn. The elapsed time is printed, not asserted (no timing in tests).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TWO_STAGE_THRESHOLD } from '../../src/core/cluster/hierarchy/two-stage';
import { normal, seededRandom } from '../../src/core/random';
import { hookState, openThroughChooser, OUTPUT, startHarness, waitForRuns, type Harness } from './harness';

const N = 20_000;
const D = 40;
const K = 6;

/** Seeded blobs: K centres at N(0, 3²) per feature, unit noise; 3 subjects, 10 s windows. */
function blobsCsv(seed: number): string {
  const random = seededRandom(seed);
  const centres = Array.from({ length: K * D }, () => 3 * normal(random));
  const features = Array.from({ length: D }, (_, j) => `f${String(j + 1).padStart(2, '0')}`);
  const lines = [['window_id', 'subject', 'start', 'end', ...features].join(',')];
  for (let i = 0; i < N; i++) {
    const c = Math.floor(random() * K);
    const subject = `S${(i % 3) + 1}`;
    const start = 1_700_000_000 + Math.floor(i / 3) * 10;
    const row = [`W${String(i).padStart(5, '0')}`, subject, String(start), String(start + 10)];
    for (let j = 0; j < D; j++) row.push((centres[c * D + j] + normal(random)).toFixed(4));
    lines.push(row.join(','));
  }
  return lines.join('\n') + '\n';
}

/** Progress bar value and stage text while a run is busy (null when idle). */
function progressNow(page: Page): Promise<{ value: number; stage: string } | null> {
  return page.evaluate(() => {
    const bar = document.querySelector('footer progress') as HTMLProgressElement | null;
    const stage = document.querySelector('[data-testid="status-stage"]');
    return bar ? { value: bar.value, stage: stage?.textContent ?? '' } : null;
  });
}

describe('exact Ward on 20,000 windows, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('runs to the end with progress while the UI keeps answering', async () => {
    const { page } = h;
    const path = join(h.tempDir, 'blobs-20k.csv');
    writeFileSync(path, blobsCsv(20_240_611));
    // The app takes the exact path up to this many windows (two-stage above).
    expect(N).toBeLessThanOrEqual(TWO_STAGE_THRESHOLD);

    await page.goto(h.url);
    await openThroughChooser(page, path);
    await page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows === n, N, { timeout: 60_000 });
    await page.locator('#param-cluster').selectOption('ward');
    await page.getByLabel('Clusters (k)').fill(String(K));

    const t0 = Date.now();
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await page.getByRole('button', { name: 'Cancel' }).waitFor();

    // Sample the progress every half second while the run is busy; answer the UI in between.
    const seen = new Set<string>();
    /** Seconds after Run at which each stage was first seen (for the printed report only). */
    const stageAt = new Map<string, number>();
    let aboutChecked = false;
    let frames = 0;
    for (;;) {
      const p = await progressNow(page);
      if (!p) break;
      seen.add(`${p.value.toFixed(3)}|${p.stage}`);
      const stage = p.stage.split(' · ')[0];
      if (!stageAt.has(stage)) stageAt.set(stage, (Date.now() - t0) / 1000);
      if (!aboutChecked && p.value > 0) {
        // The UI thread answers while the worker computes: a frame comes, About opens and closes.
        await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(resolve)));
        frames++;
        await page.getByRole('button', { name: 'About' }).click();
        await page.getByRole('dialog').waitFor({ timeout: 5_000 });
        await page.getByRole('button', { name: 'Close' }).click();
        await page.getByRole('dialog').waitFor({ state: 'detached', timeout: 5_000 });
        aboutChecked = await hookState(page).then((s) => s.busy);
      }
      await page.waitForTimeout(500);
    }
    await waitForRuns(page, 1, 200_000);
    const seconds = (Date.now() - t0) / 1000;
    console.log(`ward-large: exact Ward, ${N} windows × ${D} features, k = ${K}: run finished in ${seconds.toFixed(1)} s (wall clock, shared machine; load, PCA and Ward together)`);
    console.log(`ward-large: ${seen.size} distinct progress states seen; stages first seen at ${[...stageAt].map(([st, t]) => `${st} ${t.toFixed(1)} s`).join(', ')}`);

    // The progress moved at least twice (three distinct states) and the UI answered mid-run.
    expect(seen.size).toBeGreaterThanOrEqual(3);
    expect(frames).toBe(1);
    expect(aboutChecked).toBe(true);
    const s = await hookState(page);
    expect(s.windows).toBe(N);
    expect(s.pointsDrawn).toBe(N);
    expect(s.clustersDrawn).toBe(K);
    await expect(page.getByRole('alert').count()).resolves.toBe(0);
    await page.screenshot({ path: join(OUTPUT, 'ward-large-done.png') });
    expect(h.pageErrors).toEqual([]);
  }, 260_000);
});
