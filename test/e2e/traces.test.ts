/**
 * End to end, browser mode: the Traces view on the demo study. Reads the demo windows table and
 * the demo raw files (demo-data/raw, generated here when missing) served beside the app with
 * byte-range requests; selects on the Map, focuses a cluster, hovers both ways, links through a
 * manifest that names a missing file, switches to the CSV sources and to the overlay.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hookState, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const RAW = join(ROOT, 'demo-data/raw');
const demoLines = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0);
const DEMO_WINDOWS = demoLines.length - 1;
const SUBJECTS = [...new Set(demoLines.slice(1).map((l) => l.split(',')[1]))].sort();

/**
 * The physical dimension (unit) of the first signal of an EDF file, read straight from its header
 * (EDF specification, Kemp et al. 1992, "header record": number of signals in bytes 252–255, then
 * per signal 16 bytes label, 80 transducer, 8 physical dimension), independently of the app.
 */
function edfFirstUnit(path: string): string {
  const head = readFileSync(path).subarray(0, 256 + 256 * 64);
  const ns = Number(head.subarray(252, 256).toString('ascii').trim());
  const at = 256 + ns * (16 + 80);
  return head.subarray(at, at + 8).toString('ascii').trim();
}

interface TraceItem { window: number; state: string; text: string }

function items(page: Page): Promise<TraceItem[]> {
  return page.$$eval('[aria-label="Traces shown"] li', (lis) =>
    lis.map((li) => ({ window: Number(li.getAttribute('data-window')), state: li.getAttribute('data-state') ?? '', text: li.textContent ?? '' })));
}

async function settled(page: Page, count?: number): Promise<TraceItem[]> {
  await page.waitForFunction((n) => {
    const lis = [...document.querySelectorAll('[aria-label="Traces shown"] li')];
    return lis.length > 0 && (n === undefined || lis.length === n) && lis.every((li) => li.getAttribute('data-state') !== 'loading');
  }, count, { timeout: 30_000, polling: 100 });
  return items(page);
}

function cells(page: Page): Promise<{ index: number; x: number; y: number; w: number; h: number; state: string }[]> {
  return page.$eval('canvas[aria-label="Raw signal traces"]', (c) => JSON.parse(c.getAttribute('data-cells') ?? '[]'));
}

describe('Traces view, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    if (!SUBJECTS.every((s) => existsSync(join(RAW, `${s}.edf`)) && existsSync(join(RAW, `${s}.csv`)))) {
      execFileSync('npm', ['run', 'demo-data', '--', '--raw'], { cwd: ROOT, stdio: 'inherit' });
    }
    h = await startHarness();
  }, 600_000);
  afterAll(async () => {
    await h?.close();
  });

  it('shows raw signals with units for selected windows and cluster members, links hover both ways, and reports missing files per trace', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows === n, DEMO_WINDOWS, { timeout: 60_000 });
    await page.getByLabel('Clusters (k)').fill('7');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);
    await page.getByRole('tab', { name: 'Traces' }).click();
    await expect(page.getByText('Select windows on the Map').count()).resolves.toBe(1);

    // Box-select around window 0 on the Map.
    const p0 = await page.evaluate(() => (window as unknown as { __gleaner: { screenPosition(i: number): { x: number; y: number } | null } }).__gleaner.screenPosition(0));
    expect(p0).not.toBeNull();
    await page.getByRole('button', { name: 'Box' }).click();
    await page.mouse.move(p0!.x - 12, p0!.y - 12);
    await page.mouse.down();
    await page.mouse.move(p0!.x + 12, p0!.y + 12, { steps: 5 });
    await page.mouse.up();
    const selected = (await hookState(page)).selectionSize;
    expect(selected).toBeGreaterThan(0);
    let shown = await settled(page, Math.min(24, selected));
    const unit = edfFirstUnit(join(RAW, `${SUBJECTS[0]}.edf`));
    expect(unit).toBe('g');
    expect(shown.some((t) => t.window === 0)).toBe(true);
    for (const t of shown) {
      expect(t.state, t.text).toBe('ok');
      expect(t.text).toContain(`(${unit})`);
    }

    // Hover a trace: its window lights up on the Map.
    const [first] = await cells(page);
    const box = (await page.locator('canvas[aria-label="Raw signal traces"]').boundingBox())!;
    await page.mouse.move(box.x + first.x + first.w / 2, box.y + first.y + first.h / 2);
    await expect.poll(() => page.locator('svg[data-highlight]').getAttribute('data-highlight')).toBe(String(first.index));
    // And the other way: hover window 0 on the Map, its trace is outlined.
    await page.getByRole('button', { name: 'Pan' }).click();
    await page.mouse.move(p0!.x, p0!.y);
    await expect.poll(() => page.locator('canvas[aria-label="Raw signal traces"]').getAttribute('data-highlight')).toBe('0');
    await page.screenshot({ path: join(OUTPUT, 'traces-selection.png') });

    // Focus the cluster of window 0: 4 typical and 4 borderline members.
    const c0 = await page.evaluate(() => (window as unknown as { __gleaner: { clusterOf(i: number): number } }).__gleaner.clusterOf(0));
    await page.getByLabel('Focus cluster').selectOption(String(c0));
    shown = await settled(page, 8);
    expect(shown.every((t) => t.state === 'ok')).toBe(true);
    await expect(page.getByText(/Most typical of/).count()).resolves.toBe(0); // drawn on the canvas, not as text
    await page.mouse.move(5, 5);
    await page.screenshot({ path: join(OUTPUT, 'traces.png') });

    // A manifest naming a missing file for one subject: that subject's traces say so, the rest still draw.
    const missingSubject = shown[0].text.split('subject ')[1].split(':')[0];
    const manifest = join(h.tempDir, 'manifest.csv');
    writeFileSync(manifest, ['subject,path', ...SUBJECTS.map((s) => `${s},${s === missingSubject ? 'gone.edf' : `raw/${s}.edf`}`)].join('\n') + '\n');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByRole('button', { name: 'Manifest…' }).click()]);
    await chooser.setFiles(manifest);
    await page.waitForFunction(() => [...document.querySelectorAll('[aria-label="Traces shown"] li')].some((li) => li.textContent?.includes('not found')), undefined, { timeout: 30_000 });
    shown = await settled(page, 8);
    for (const t of shown) {
      if (t.text.includes(`subject ${missingSubject}:`)) expect(t.text).toContain('raw file gone.edf not found');
      else expect(t.state, t.text).toBe('ok');
    }
    await page.screenshot({ path: join(OUTPUT, 'traces-missing.png') });

    // The CSV sources of the same recordings, through the file pattern.
    await page.getByLabel('Raw file pattern').fill('{subject}.csv');
    await page.getByLabel('Raw file pattern').press('Enter');
    await page.waitForFunction(() => [...document.querySelectorAll('[aria-label="Traces shown"] li')].every((li) => li.textContent?.includes('.csv') || li.getAttribute('data-state') === 'loading'), undefined, { timeout: 30_000 });
    shown = await settled(page, 8);
    expect(shown.every((t) => t.state === 'ok' && t.text.includes('.csv'))).toBe(true);

    // Overlay: aligned members with median and interquartile band.
    await page.getByLabel('Traces mode').selectOption('overlay');
    await page.screenshot({ path: join(OUTPUT, 'traces-overlay.png') });
    expect(h.pageErrors).toEqual([]);
    await expect(page.getByRole('alert').count()).resolves.toBe(0);
  }, 240_000);
});
