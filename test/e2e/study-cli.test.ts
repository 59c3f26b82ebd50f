/**
 * End to end, browser mode then the CLI: curate a Ward run in the app (rename, set aside, merge,
 * split into 3 — undone and redone), open the Tree and the Mix, export (weak labels, figures) and
 * save the study; then `gleaner run` on the saved study must write the same per-window weak-label
 * CSV byte for byte. Reads the demo windows from demo-data/.
 */
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZip } from '../../src/core/study/zip';
import { openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const K = 6;
const SPLIT_INTO = 3;

type Hook = {
  windows: number;
  busy: boolean;
  treeBranches: number;
  views: { mixBars: number };
  clusterName(c: number): string;
  clusterSetAside(c: number): boolean;
};

const liveClusters = (page: Page) => page.getByLabel(/^Edit cluster \d+$/).count();

async function edit(page: Page, c: number): Promise<void> {
  const button = page.getByLabel(`Edit cluster ${c + 1}`);
  if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
}

describe('study → gleaner run, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('splits a cluster (undo restores it), shows the curation in the Mix and Tree, exports their figures, and the CLI reproduces the weak labels byte for byte', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction(() => (window as unknown as { __gleaner: Hook }).__gleaner.windows > 0, undefined, { timeout: 60_000 });
    await page.locator('#param-cluster').selectOption('ward');
    await page.getByLabel('Clusters (k)').fill(String(K));
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);
    expect(await liveClusters(page)).toBe(K);

    // Split cluster 2 into 3 parts: the cluster count rises by 3 − 1; undo restores it, redo brings the parts back.
    await edit(page, 1);
    await page.getByLabel('Split cluster 2 into').fill(String(SPLIT_INTO));
    await page.getByRole('button', { name: 'Split', exact: true }).click();
    await expect.poll(() => liveClusters(page), { timeout: 60_000 }).toBe(K + SPLIT_INTO - 1);
    await page.locator('.brand').click();
    await page.keyboard.press('Control+z');
    await expect.poll(() => liveClusters(page)).toBe(K);
    await page.keyboard.press('Control+Shift+z');
    await expect.poll(() => liveClusters(page)).toBe(K + SPLIT_INTO - 1);

    // Rename, set aside, merge two clusters.
    await page.getByLabel('Name of cluster 1').fill('walking');
    await page.getByLabel('Name of cluster 1').press('Enter');
    await page.locator('.brand').click();
    await edit(page, 2);
    await page.getByLabel('Set aside cluster 3').check();
    await page.getByLabel('Select cluster 4').check();
    await page.getByLabel('Select cluster 5').check();
    await page.getByRole('button', { name: 'Merge 2 ticked' }).click();
    const live = K + SPLIT_INTO - 1 - 1;
    await expect.poll(() => liveClusters(page)).toBe(live);
    expect(await page.evaluate(() => (window as unknown as { __gleaner: Hook }).__gleaner.clusterSetAside(2))).toBe(true);

    // The Mix and the Tree draw the curated clusters: one Mix bar per live cluster (not the run's k).
    await page.getByRole('tab', { name: 'Tree' }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: Hook }).__gleaner.treeBranches > 0, undefined, { timeout: 30_000 });
    await page.screenshot({ path: join(OUTPUT, 'study-cli-tree.png') });
    await page.getByRole('tab', { name: 'Mix' }).click();
    await expect.poll(() => page.evaluate(() => (window as unknown as { __gleaner: Hook }).__gleaner.views.mixBars), { timeout: 30_000 }).toBe(live);
    await page.screenshot({ path: join(OUTPUT, 'study-cli-mix.png') });

    // Export (one ZIP in browser mode) and save the study.
    await page.getByRole('button', { name: 'Export…' }).click();
    const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
    const zipPath = join(h.tempDir, 'export.zip');
    await zip.saveAs(zipPath);
    const byName = new Map(readZip(new Uint8Array(readFileSync(zipPath))).map((e) => [e.name, Buffer.from(e.data)]));
    for (const name of ['windows-weak-labels.csv', 'windows-tree.svg', 'windows-tree.png', 'windows-mix.svg', 'windows-mix.png', 'windows-report.html']) {
      expect(byName.has(name), `${name} in ${[...byName.keys()].join(', ')}`).toBe(true);
    }
    // PNG signature (PNG specification, ISO/IEC 15948, section 5.2).
    const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
    for (const f of ['tree', 'mix']) {
      expect([...byName.get(`windows-${f}.png`)!.subarray(0, 8)]).toEqual(PNG);
      writeFileSync(join(OUTPUT, `study-cli-export-${f}.png`), byName.get(`windows-${f}.png`)!);
      writeFileSync(join(OUTPUT, `study-cli-export-${f}.svg`), byName.get(`windows-${f}.svg`)!);
    }
    const mixSvg = byName.get('windows-mix.svg')!.toString('utf8');
    expect(mixSvg.startsWith('<svg')).toBe(true);
    expect(mixSvg).toContain('walking');
    expect(byName.get('windows-tree.svg')!.toString('utf8')).toContain('stroke-dasharray'); // the cut line
    const report = byName.get('windows-report.html')!.toString('utf8');
    expect(report).toContain('Tree: ward linkage');
    expect(report).toContain('Mix: clusters by');

    const dir = join(h.tempDir, 'cli');
    mkdirSync(dir, { recursive: true });
    const studyPath = join(dir, 'windows.gleaner');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /^Save/ }).first().click()]);
    await download.saveAs(studyPath);
    expect(h.pageErrors).toEqual([]);

    // The study saved the input as "windows.csv": gleaner run reads it beside the study file.
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    const out = join(dir, 'out');
    execFileSync('node', ['--import', 'tsx', 'src/cli/main.ts', 'run', studyPath, '--out', out, '--progress', 'none'], { cwd: ROOT, stdio: 'pipe' });
    const runs = readdirSync(out);
    expect(runs).toHaveLength(1);
    for (const name of ['windows-weak-labels.csv', 'windows-label-first.csv', 'windows-events.tsv']) {
      const cli = readFileSync(join(out, runs[0], name));
      expect(cli.equals(byName.get(name)!), `${name}: the app's and gleaner run's bytes differ`).toBe(true);
    }
  });
});
