/**
 * End to end, browser mode: the Quality view (missingness heat map, issue lists whose buttons add
 * recipe steps), the Recipe editor feeding a run and the provenance export, the whole bad-input
 * catalogue through the file chooser, and a large file streaming in while the previous study's
 * Map is panned and the load is cancelled. The catalogue comes from test/fixtures/generate-bad-inputs.ts.
 */
import { closeSync, openSync, readFileSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/core/random';
import { readZip } from '../../src/core/study/zip';
import { BAD_INPUT_CATALOGUE, generateBadInputs } from '../fixtures/generate-bad-inputs';
import { hookState, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;

function position0(page: Page): Promise<{ x: number; y: number } | null> {
  return page.evaluate(() => (window as unknown as { __gleaner: { screenPosition(i: number): { x: number; y: number } | null } }).__gleaner.screenPosition(0));
}

/** Opens the demo study and runs it; turns down the offer to restore an autosaved study (earlier tests leave one). */
async function demo(page: Page, url: string): Promise<void> {
  await page.goto(`${url}?demo=1`);
  await waitForRuns(page, 1);
  const discard = page.getByRole('button', { name: 'Discard' });
  await discard.waitFor({ timeout: 3_000 }).then(() => discard.click(), () => undefined);
}

/** Writes a windows table of `rows` × 40 features with long decimals (about 19 bytes a value). */
function writeLargeCsv(path: string, rows: number): void {
  const random = seededRandom(11);
  const fd = openSync(path, 'w');
  const features = Array.from({ length: 40 }, (_, j) => `f${j}`);
  writeSync(fd, `window_id,subject,start,${features.join(',')}\n`);
  let block: string[] = [];
  for (let i = 0; i < rows; i++) {
    const values = features.map(() => random().toFixed(16));
    block.push(`w${i},S${i % 20},${10 * i},${values.join(',')}`);
    if (block.length === 5000) {
      writeSync(fd, `${block.join('\n')}\n`);
      block = [];
    }
  }
  if (block.length) writeSync(fd, `${block.join('\n')}\n`);
  closeSync(fd);
}

describe('Quality view, recipe editor and loading, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('says the demo has no missing value in one line, adds a suggested step to the recipe, and the export records the recipe', async () => {
    const { page } = h;
    await demo(page, h.url);

    await page.getByRole('tab', { name: 'Quality' }).click();
    // The demo study has no missing value: the matrix collapses to one line (the heat map is drawn
    // for a table with gaps in the next test).
    await expect.poll(() => page.getByTestId('no-missing').textContent(), { timeout: 60_000 }).toBe('No missing values in 4,851 windows × 40 features.');
    expect(await page.getByTestId('missingness-heatmap').count()).toBe(0);

    // The demo study's correlated features (gyr_mag_mean and gyr_mag_p90, among others) propose prune-correlated.
    const correlated = page.getByRole('region', { name: 'Highly correlated pairs' });
    await expect(correlated.textContent()).resolves.toContain('correlate at r =');
    await page.screenshot({ path: join(OUTPUT, 'quality.png') });
    await correlated.getByRole('button', { name: 'Add prune-correlated' }).first().click();
    const steps = page.getByRole('list', { name: 'Recipe steps' });
    await expect(steps.locator('li[data-step]').evaluateAll((li) => li.map((e) => e.getAttribute('data-step'))))
      .resolves.toEqual(['zscore', 'impute', 'prune-correlated']);
    await page.locator('section[aria-labelledby="recipe-title"]').screenshot({ path: join(OUTPUT, 'recipe.png') });

    // An invalid parameter is refused with the core's message naming the step and field.
    const threshold = steps.locator('li[data-step="prune-correlated"] input');
    await threshold.fill('1.5');
    await threshold.press('Tab');
    await expect(page.getByTestId('recipe-error').textContent()).resolves.toMatch(/recipe step 3 \(prune-correlated\) threshold/);
    await threshold.fill('0.95');
    await threshold.press('Tab');
    await expect(page.getByTestId('recipe-error').count()).resolves.toBe(0);

    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 2);
    await page.getByRole('button', { name: 'Export…' }).click();
    const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
    const zipPath = join(h.tempDir, 'quality-export.zip');
    await zip.saveAs(zipPath);
    const prov = readZip(new Uint8Array(readFileSync(zipPath))).find((e) => e.name.endsWith('-provenance.json'))!;
    const path = join(h.tempDir, 'quality-provenance.json');
    writeFileSync(path, prov.data);
    const provenance = JSON.parse(readFileSync(path, 'utf8'));
    expect(provenance.recipeSpec.steps.map((s: { type: string }) => s.type)).toEqual(['zscore', 'impute', 'prune-correlated']);
    expect(provenance.recipeSpec.steps[2].threshold).toBe(0.95);
    const applied = provenance.recipe.map((s: { step: string }) => s.step);
    expect(applied).toEqual(['zscore', 'impute', 'prune-correlated']);
    // It dropped at least the later feature of the demo's strongest pair (r = 0.982 > 0.95).
    expect(provenance.recipe[2].effect.dropped.length).toBeGreaterThan(0);
    expect(h.pageErrors).toEqual([]);
  });

  it('shows each case of the bad-input catalogue where the user looks, keeps the previous study, then loads a good file', async () => {
    const { page } = h;
    const dir = join(h.tempDir, 'catalogue');
    await generateBadInputs(dir);
    await demo(page, h.url);
    const refused = BAD_INPUT_CATALOGUE.filter((c) => c.exit === 1);
    for (const c of refused) {
      await openThroughChooser(page, join(dir, c.fileName));
      const alert = page.getByRole('alert');
      await alert.waitFor({ timeout: 30_000 });
      const text = (await alert.textContent()) ?? '';
      expect(text, c.name).toMatch(c.expected);
      const s = await hookState(page);
      expect(s.busy, c.name).toBe(false);
      expect(s.windows, c.name).toBe(DEMO_WINDOWS);
      expect(s.pointsDrawn, c.name).toBe(DEMO_WINDOWS);
      await expect(page.getByTestId('status').textContent()).resolves.toContain('Kept the previous study (windows.csv)');
      await page.getByRole('button', { name: 'Dismiss' }).click();
    }
    // Accepted with a warning: it loads, and the warning shows in the status bar and the Quality view.
    for (const c of BAD_INPUT_CATALOGUE.filter((x) => x.exit === 0)) {
      await openThroughChooser(page, join(dir, c.fileName));
      const warning = new RegExp(c.expected.source.replace('^gleaner: warning: ', ''));
      await expect.poll(() => page.getByTestId('status').textContent(), { timeout: 30_000 }).toMatch(warning);
      await expect(page.getByRole('alert').count()).resolves.toBe(0);
      await page.getByRole('tab', { name: 'Quality' }).click();
      await expect(page.getByRole('region', { name: 'Warnings from loading' }).textContent()).resolves.toMatch(warning);
      await page.getByRole('tab', { name: 'Quality' }).click();
    }
    // A good file still loads.
    await openThroughChooser(page, DEMO);
    await page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number; busy: boolean } }).__gleaner.windows === n, DEMO_WINDOWS, { timeout: 60_000 });
    await expect(page.getByTestId('status').textContent()).resolves.toContain(`Loaded windows.csv: ${DEMO_WINDOWS} windows`);
    expect(h.pageErrors).toEqual([]);
  }, 240_000);

  it('draws the missing-value heat map, subject by feature, when cells are missing', async () => {
    const { page } = h;
    const path = join(h.tempDir, 'gaps.csv');
    // 3 subjects × 3 features; f2 is missing in every fifth window of S1 only.
    const rows = Array.from({ length: 60 }, (_, i) => `w${i},S${(i % 3) + 1},${(i % 7) * 0.5},${i % 3 === 0 && i % 5 === 0 ? '' : (i % 5) * 1.5},${i % 2}`);
    writeFileSync(path, `window_id,subject,f1,f2,f3\n${rows.join('\n')}\n`);
    await openThroughChooser(page, path);
    await page.waitForFunction(() => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows === 60, undefined, { timeout: 60_000 });
    await page.getByRole('tab', { name: 'Quality' }).click();
    const heat = page.getByTestId('missingness-heatmap');
    await heat.waitFor({ timeout: 60_000 });
    await expect.poll(async () => Number(await heat.getAttribute('data-cells'))).toBe(3 * 3);
    // Cells with no missing value are viridis(0) = #440154 (matplotlib's viridis, first entry); the S1 × f2 cell is not.
    const [dark, other] = await heat.evaluate((c: HTMLCanvasElement) => {
      const px = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      let d = 0, o = 0;
      for (let i = 0; i < px.length; i += 4) {
        if (px[i] === 0x44 && px[i + 1] === 0x01 && px[i + 2] === 0x54) d++;
        else if (px[i + 3] === 255 && !(px[i] === 255 && px[i + 1] === 255 && px[i + 2] === 255) && px[i] + px[i + 1] > 200) o++;
      }
      return [d, o];
    });
    expect(dark).toBeGreaterThan(100);
    expect(other).toBeGreaterThan(10);
    expect(await page.getByTestId('no-missing').count()).toBe(0);
    await page.screenshot({ path: join(OUTPUT, 'quality-gaps.png') });
  });

  it('keeps the previous Map pannable while a large file streams in, and Cancel stops the load', async () => {
    const { page } = h;
    const big = join(h.tempDir, 'large-windows.csv');
    writeLargeCsv(big, 300_000);
    await demo(page, h.url);
    await page.getByRole('button', { name: 'Pan' }).click();

    await openThroughChooser(page, big);
    await page.waitForFunction(() => Number((document.querySelector('footer progress') as HTMLProgressElement | null)?.value ?? 0) > 0, null, { timeout: 30_000, polling: 20 });
    expect((await hookState(page)).busy).toBe(true);
    await expect(page.getByTestId('status').textContent()).resolves.toContain('Reading large-windows.csv');

    // Drag the Map of the previous study: window 0's point moves with it.
    const before = await position0(page);
    expect(before).not.toBeNull();
    await page.mouse.move(before!.x, before!.y);
    await page.mouse.down();
    await page.mouse.move(before!.x + 80, before!.y + 50, { steps: 5 });
    await page.mouse.up();
    const after = await position0(page);
    expect(after!.x - before!.x).toBeCloseTo(80, 0);
    expect(after!.y - before!.y).toBeCloseTo(50, 0);
    expect((await hookState(page)).busy).toBe(true); // still loading: the drag was not a freeze's leftover

    await page.getByRole('button', { name: 'Cancel' }).click();
    await page.waitForFunction(() => !(window as unknown as { __gleaner: { busy: boolean } }).__gleaner.busy, null, { timeout: 30_000 });
    await expect(page.getByTestId('status').textContent()).resolves.toContain('Opening large-windows.csv was cancelled');
    expect((await hookState(page)).windows).toBe(DEMO_WINDOWS);
    await page.getByRole('button', { name: 'Fit view' }).click();
    await expect.poll(async () => (await hookState(page)).pointsDrawn).toBe(DEMO_WINDOWS);
    expect(h.pageErrors).toEqual([]);
  }, 240_000);
});
