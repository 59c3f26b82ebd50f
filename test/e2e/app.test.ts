/**
 * End to end, browser mode: the built renderer on a loopback server, driven in headless Chromium
 * through its buttons, file chooser and mouse. Reads the demo study from demo-data/ and the shared
 * bad-input fixtures from test/fixtures/bad-inputs.ts.
 */
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../src/core/cautions';
import { readZip } from '../../src/core/study/zip';
import { BAD_INPUTS } from '../fixtures/bad-inputs';
import { hookState, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const demoLines = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0);
const DEMO_WINDOWS = demoLines.length - 1; // one header line, no quoted line breaks in the demo table
const DEMO_IDS = demoLines.slice(1).map((l) => l.slice(0, l.indexOf(',')));

/** Even–odd point-in-polygon (common practice), written here independently of the app's own. */
function inside(poly: [number, number][], x: number, y: number): boolean {
  let c = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i], [xj, yj] = poly[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

function screenPositions(page: Page, n: number): Promise<({ x: number; y: number } | null)[]> {
  return page.evaluate((count) => {
    const h = (window as unknown as { __gleaner: { screenPosition(i: number): { x: number; y: number } | null } }).__gleaner;
    return Array.from({ length: count }, (_, i) => h.screenPosition(i));
  }, n);
}

function clusters(page: Page, n: number): Promise<number[]> {
  return page.evaluate((count) => {
    const h = (window as unknown as { __gleaner: { clusterOf(i: number): number } }).__gleaner;
    return Array.from({ length: count }, (_, i) => h.clusterOf(i));
  }, n);
}

async function loadDemoAndRun(page: Page, url: string, runsBefore: number, k?: number): Promise<void> {
  await page.goto(url);
  await openThroughChooser(page, DEMO);
  await page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number; busy: boolean } }).__gleaner.windows === n, DEMO_WINDOWS, { timeout: 60_000 });
  if (k !== undefined) await page.getByLabel('Clusters (k)').fill(String(k));
  await page.getByRole('button', { name: 'Run', exact: true }).click();
  await waitForRuns(page, runsBefore + 1);
}

describe('browser mode, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('opens the demo windows, runs, lasso-selects, renames a cluster and exports weak labels with provenance', async () => {
    const { page } = h;
    const k = 7;
    await loadDemoAndRun(page, h.url, 0, k);
    let s = await hookState(page);
    expect(s.windows).toBe(DEMO_WINDOWS);
    expect(s.pointsDrawn).toBe(DEMO_WINDOWS);
    expect(s.clustersDrawn).toBe(k);
    await expect(page.getByRole('alert').count()).resolves.toBe(0);

    // Hover over window 0: the tooltip names it.
    const [p0] = await screenPositions(page, 1);
    expect(p0).not.toBeNull();
    await page.mouse.move(p0!.x, p0!.y);
    await expect(page.getByRole('tooltip').textContent()).resolves.toContain(DEMO_IDS[0]);

    // Lasso: an octagon of radius 45 px around window 0.
    await page.getByRole('button', { name: 'Lasso' }).click();
    const poly: [number, number][] = Array.from({ length: 8 }, (_, j) => [
      p0!.x + 45 * Math.cos((j * Math.PI) / 4),
      p0!.y + 45 * Math.sin((j * Math.PI) / 4),
    ]);
    await page.mouse.move(poly[0][0], poly[0][1]);
    await page.mouse.down();
    for (const [x, y] of [...poly.slice(1), poly[0]]) await page.mouse.move(x, y, { steps: 4 });
    await page.mouse.up();
    s = await hookState(page);
    expect(s.selectionSize).toBeGreaterThan(0);
    expect(s.selectionSize).toBeLessThan(DEMO_WINDOWS);
    const positions = await screenPositions(page, DEMO_WINDOWS);
    const expected = positions.filter((p) => p && inside(poly, p.x, p.y)).length;
    // Points lying on the lasso's edge may fall either way.
    expect(Math.abs(s.selectionSize - expected)).toBeLessThanOrEqual(2);
    await expect(page.getByTestId('selection-summary').textContent()).resolves.toContain(String(s.selectionSize));
    await page.screenshot({ path: join(OUTPUT, 'map.png') });

    // Rename the cluster of window 0.
    const labels = await clusters(page, DEMO_WINDOWS);
    const c0 = labels[0];
    const className = 'arm swing';
    await page.getByLabel(`Name of cluster ${c0 + 1}`).fill(className);
    await page.getByLabel(`Name of cluster ${c0 + 1}`).press('Enter');

    // Export: the one Export dialog downloads one ZIP in browser mode.
    await page.getByRole('button', { name: 'Export…' }).click();
    await expect(page.getByText('Downloads one ZIP file holding everything ticked below.').count()).resolves.toBe(1);
    const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
    expect(zip.suggestedFilename()).toBe('windows-export.zip');
    const zipPath = join(h.tempDir, 'export.zip');
    await zip.saveAs(zipPath);
    // Unpacked with the app's own ZIP reader (src/core/study/zip.ts, tested on its own in test/core).
    const byName = new Map(readZip(new Uint8Array(readFileSync(zipPath))).map((e) => [e.name, Buffer.from(e.data)]));
    expect(byName.has('windows-weak-labels.csv') && byName.has('windows-provenance.json')).toBe(true);
    const csvPath = join(h.tempDir, 'labels.csv');
    const jsonPath = join(h.tempDir, 'provenance.json');
    writeFileSync(csvPath, byName.get('windows-weak-labels.csv')!);
    writeFileSync(jsonPath, byName.get('windows-provenance.json')!);

    const rows = readFileSync(csvPath, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).map((l) => l.split(','));
    const header = rows.shift()!;
    expect(rows).toHaveLength(DEMO_WINDOWS);
    const col = (name: string) => {
      const j = header.indexOf(name);
      expect(j, `column ${name} in ${header.join(',')}`).toBeGreaterThanOrEqual(0);
      return j;
    };
    const [idCol, clusterCol, classCol] = [col('window_id'), col('cluster'), col('class_name')];
    rows.forEach((r, i) => {
      expect(r[idCol]).toBe(DEMO_IDS[i]);
      // Clusters are exported by number, index + 1, as the list shows them.
      expect(Number(r[clusterCol])).toBe(labels[i] + 1);
      expect(r[classCol]).toBe(labels[i] === c0 ? className : '');
    });

    const provenance = JSON.parse(readFileSync(jsonPath, 'utf8'));
    expect(provenance.cautions).toEqual(CAUTIONS);
    // The hash of the input file, computed here with Node's crypto (independently of the app's Web Crypto).
    expect(provenance.input.sha256).toBe(createHash('sha256').update(readFileSync(DEMO)).digest('hex'));
    expect(provenance.input.rows).toBe(DEMO_WINDOWS);
    expect(provenance.clusters[c0]).toMatchObject({ number: c0 + 1, name: className, className });
    expect(provenance.cluster.k).toBe(k);

    // Zoom in around window 0: fewer points in view; Fit view brings all back.
    await page.getByRole('button', { name: 'Pan' }).click();
    await page.mouse.move(p0!.x, p0!.y);
    for (let i = 0; i < 5; i++) await page.mouse.wheel(0, -400);
    await expect.poll(async () => (await hookState(page)).pointsDrawn).toBeLessThan(DEMO_WINDOWS);
    await page.getByRole('button', { name: 'Fit view' }).click();
    await expect.poll(async () => (await hookState(page)).pointsDrawn).toBe(DEMO_WINDOWS);
    expect(h.pageErrors).toEqual([]);
  });

  it('refuses each bad input with a message naming the file, and keeps the previous study working', async () => {
    const { page } = h;
    await loadDemoAndRun(page, h.url, 0);
    for (const bad of BAD_INPUTS) {
      const path = join(h.tempDir, bad.fileName);
      writeFileSync(path, bad.content);
      await openThroughChooser(page, path);
      const alert = page.getByRole('alert');
      await alert.waitFor({ timeout: 30_000 });
      const text = (await alert.textContent()) ?? '';
      expect(text, bad.name).toContain(bad.fileName);
      expect(text, bad.name).toMatch(bad.expected);
      const s = await hookState(page);
      expect(s.busy, bad.name).toBe(false);
      expect(s.windows, bad.name).toBe(DEMO_WINDOWS);
      expect(s.pointsDrawn, bad.name).toBe(DEMO_WINDOWS);
      await expect(page.locator('header').textContent()).resolves.toContain('windows.csv');
      await page.getByRole('button', { name: 'Dismiss' }).click();
    }
    // Dropping a file on the window takes the same path as Open.
    const dropped = BAD_INPUTS[2];
    await page.evaluate(({ name, content }) => {
      const transfer = new DataTransfer();
      transfer.items.add(new File([content], name, { type: 'text/csv' }));
      window.dispatchEvent(new DragEvent('drop', { dataTransfer: transfer, bubbles: true, cancelable: true }));
    }, { name: dropped.fileName, content: dropped.content });
    await page.getByRole('alert').waitFor({ timeout: 30_000 });
    await expect(page.getByRole('alert').textContent()).resolves.toMatch(dropped.expected);
    expect((await hookState(page)).windows).toBe(DEMO_WINDOWS);
    // The kept study still runs.
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 2);
    expect((await hookState(page)).pointsDrawn).toBe(DEMO_WINDOWS);
    expect(h.pageErrors).toEqual([]);
  });

  it('cancels a long run and stays responsive, keeping the previous map', async () => {
    const { page } = h;
    // Start-up with ?demo=1 loads the demo study and runs it with the default parameters.
    h.consoleErrors.length = 0;
    await page.goto(`${h.url}?demo=1`);
    await waitForRuns(page, 1);
    // Nothing failed to load on the way (the page's icon included) and nothing was logged as an error.
    expect(h.consoleErrors).toEqual([]);
    expect((await hookState(page)).clustersDrawn).toBe(Number(await page.getByLabel('Clusters (k)').inputValue()));
    // Many restarts make the run long enough to cancel.
    await page.getByLabel('Restarts').fill('1000');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    const cancel = page.getByRole('button', { name: 'Cancel' });
    await cancel.waitFor();
    await page.waitForFunction(() => Number((document.querySelector('footer progress') as HTMLProgressElement | null)?.value ?? 0) > 0, null, { timeout: 30_000 });
    expect((await hookState(page)).busy).toBe(true);
    // The UI thread answers while the worker computes: an animation frame comes, the About dialog opens.
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(resolve)));
    await page.getByRole('button', { name: 'About' }).click();
    await expect(page.getByRole('dialog').textContent()).resolves.toContain(CAUTIONS[0]);
    await page.getByRole('button', { name: 'Close' }).click();
    await cancel.click();
    await expect.poll(async () => (await hookState(page)).busy, { timeout: 15_000 }).toBe(false);
    await expect(page.getByTestId('status').textContent()).resolves.toMatch(/cancelled/i);
    const s = await hookState(page);
    expect(s.runCount).toBe(1);
    expect(s.pointsDrawn).toBe(DEMO_WINDOWS);
    // Still usable: a short run completes.
    await page.getByLabel('Restarts').fill('2');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 2);
    expect(h.pageErrors).toEqual([]);
  });

  it('installs its test view only when a test asks for it', async () => {
    // A page of the same browser that did not ask (no enableTestHook): the app mounts as usual
    // (src/app/main.ts decides before it mounts), and window.__gleaner is not there.
    const plain = await h.context.newPage();
    try {
      await plain.goto(h.url);
      await plain.getByRole('button', { name: 'Open…' }).waitFor({ timeout: 30_000 });
      expect(await plain.evaluate(() => '__gleaner' in window)).toBe(false);
      expect(await h.page.evaluate(() => '__gleaner' in window)).toBe(true);
    } finally {
      await plain.close();
    }
  });
});
