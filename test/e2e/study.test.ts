/**
 * End to end, browser mode: the study file. Curate a run (rename, recolour, set aside, merge), save
 * the study, reopen it in a fresh browser profile (every name, colour, set-aside flag, window label
 * and view setting back, and no analysis or split job started); close the page mid-edit without
 * saving, reopen: the autosave is offered and restores the edits; undo and redo from the keyboard.
 * Reads the demo study from demo-data/.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { readZip } from '../../src/core/study/zip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { enableTestHook, openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;
const K = 6;

interface Snapshot {
  names: string[];
  colours: string[];
  aside: boolean[];
  labels: number[];
  jobs: Record<string, number>;
}

type Hook = {
  windows: number;
  pointsDrawn: number;
  busy: boolean;
  autosaves: number;
  jobsStarted: Record<string, number>;
  clusterOf(i: number): number;
  clusterName(c: number): string;
  clusterColour(c: number): string;
  clusterSetAside(c: number): boolean;
};

function snapshot(page: Page, clusters: number, windows: number): Promise<Snapshot> {
  return page.evaluate(([k, n]) => {
    const h = (window as unknown as { __gleaner: Hook }).__gleaner;
    const ids = Array.from({ length: k }, (_, c) => c);
    return {
      names: ids.map((c) => h.clusterName(c)),
      colours: ids.map((c) => h.clusterColour(c)),
      aside: ids.map((c) => h.clusterSetAside(c)),
      labels: Array.from({ length: n }, (_, i) => h.clusterOf(i)),
      jobs: h.jobsStarted,
    };
  }, [clusters, windows] as const);
}

function waitForMap(page: Page): Promise<unknown> {
  return page.waitForFunction(() => {
    const h = (window as unknown as { __gleaner: Hook }).__gleaner;
    return h.pointsDrawn > 0 && !h.busy;
  }, undefined, { timeout: 60_000, polling: 100 });
}

async function edit(page: Page, c: number): Promise<void> {
  const button = page.getByLabel(`Edit cluster ${c + 1}`);
  if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
}

async function rename(page: Page, c: number, name: string): Promise<void> {
  await page.getByLabel(`Name of cluster ${c + 1}`).fill(name);
  await page.getByLabel(`Name of cluster ${c + 1}`).press('Enter');
  await page.locator('.brand').click(); // leave the text field: the app's own undo takes the keys
}

describe('study file, end to end', () => {
  let h: Harness;
  let fresh: Harness | null = null;
  let saved: Snapshot;
  const studyPath = () => join(h.tempDir, 'windows.gleaner');

  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await fresh?.close();
    await h?.close();
  });

  it('saves a curated study and reopens it in a fresh browser with everything back and nothing recomputed', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction((n) => (window as unknown as { __gleaner: Hook }).__gleaner.windows === n, DEMO_WINDOWS, { timeout: 60_000 });
    await page.getByLabel('Clusters (k)').fill(String(K));
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);

    const before = await snapshot(page, K, DEMO_WINDOWS);
    await rename(page, 0, 'walking');
    await edit(page, 1);
    await page.getByLabel('Colour #7570b3').click();
    await edit(page, 2);
    await page.getByLabel('Set aside cluster 3').check();
    await page.getByLabel('Select cluster 4').check();
    await page.getByLabel('Select cluster 5').check();
    await page.getByRole('button', { name: 'Merge 2 ticked' }).click();
    await page.screenshot({ path: join(OUTPUT, 'study-curated.png') });
    // The Fingerprints heat map shows one row per cluster still holding windows: the merged-away one is gone.
    const header = readFileSync(DEMO, 'utf8').split(/\r?\n/)[0].split(',');
    const features = header.length - header.indexOf('activity_label') - 1; // every column after the label
    await page.getByRole('tab', { name: 'Fingerprints' }).click();
    await page.waitForFunction((want) => (window as unknown as { __gleaner: { views: { fingerprintCells: number } } }).__gleaner.views.fingerprintCells === want, (K - 1) * features, { timeout: 60_000, polling: 100 });
    await page.getByRole('tab', { name: 'Fingerprints' }).click();
    await page.getByLabel('Colour by').selectOption('subject');

    saved = await snapshot(page, K, DEMO_WINDOWS);
    expect(saved.names[0]).toBe('walking');
    expect(saved.colours[1]).toBe('#7570b3');
    expect(saved.aside).toEqual([false, false, true, false, false, false]);
    // The merge moved every window of cluster 5 (index 4) into cluster 4 (index 3).
    saved.labels.forEach((c, i) => expect(c).toBe(before.labels[i] === 4 ? 3 : before.labels[i]));
    expect(saved.labels).not.toContain(4);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /^Save/ }).first().click()]);
    expect(download.suggestedFilename()).toBe('windows.gleaner');
    await download.saveAs(studyPath());
    // A study file is a ZIP archive: local file header signature "PK\x03\x04" (PKWARE APPNOTE.TXT, section 4.3.7).
    expect([...readFileSync(studyPath()).subarray(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);

    fresh = await startHarness();
    const p2 = fresh.page;
    await p2.goto(fresh.url);
    const [chooser] = await Promise.all([p2.waitForEvent('filechooser'), p2.getByRole('button', { name: 'Open study…' }).click()]);
    await chooser.setFiles(studyPath());
    await p2.getByRole('heading', { name: 'Choose the windows table' }).waitFor({ timeout: 20_000 });
    await p2.screenshot({ path: join(OUTPUT, 'study-needs-input.png') });
    await p2.getByRole('button', { name: 'Use the demo table' }).click();
    await waitForMap(p2);

    const back = await snapshot(p2, K, DEMO_WINDOWS);
    expect(back.names).toEqual(saved.names);
    expect(back.colours).toEqual(saved.colours);
    expect(back.aside).toEqual(saved.aside);
    expect(back.labels).toEqual(saved.labels);
    // Only the windows table was parsed: no analysis and no split ran again.
    expect(back.jobs.parse).toBe(1);
    expect(back.jobs.analyze ?? 0).toBe(0);
    expect(back.jobs.split ?? 0).toBe(0);
    await expect(p2.getByLabel('Clusters (k)').inputValue()).resolves.toBe(String(K));
    await expect(p2.getByLabel('Colour by').inputValue()).resolves.toBe('subject');
    await expect(p2.getByRole('alert').count()).resolves.toBe(0);
    await p2.getByLabel('Colour by').selectOption('cluster');
    await p2.screenshot({ path: join(OUTPUT, 'study-reopened.png') });
    expect(fresh.pageErrors).toEqual([]);
  });

  it('offers the autosave after the page closes mid-edit, and restoring it brings the edits back', async () => {
    const { page, context } = h;
    const autosaves = await page.evaluate(() => (window as unknown as { __gleaner: Hook }).__gleaner.autosaves);
    await rename(page, 1, 'stairs');
    await page.waitForFunction((n) => (window as unknown as { __gleaner: Hook }).__gleaner.autosaves > n, autosaves, { timeout: 20_000, polling: 100 });
    const edited = await snapshot(page, K, DEMO_WINDOWS);
    expect(edited.names.slice(0, 2)).toEqual(['walking', 'stairs']);
    await page.close({ runBeforeUnload: false }); // no save

    const p3 = await context.newPage();
    await enableTestHook(p3);
    await p3.goto(h.url);
    await p3.getByRole('heading', { name: 'Restore unsaved work?' }).waitFor({ timeout: 20_000 });
    await p3.screenshot({ path: join(OUTPUT, 'study-autosave-offer.png') });
    await p3.getByRole('button', { name: 'Restore' }).click();
    await p3.getByRole('button', { name: 'Use the demo table' }).click();
    await waitForMap(p3);
    const restored = await snapshot(p3, K, DEMO_WINDOWS);
    expect(restored.names).toEqual(edited.names);
    expect(restored.colours).toEqual(edited.colours);
    expect(restored.aside).toEqual(edited.aside);
    expect(restored.labels).toEqual(edited.labels);
    expect(restored.jobs.analyze ?? 0).toBe(0);

    // Undo and redo from the keyboard (Ctrl+Z, Ctrl+Shift+Z, Ctrl+Y) on the restored history.
    const name = () => p3.evaluate(() => (window as unknown as { __gleaner: Hook }).__gleaner.clusterName(1));
    await p3.locator('.brand').click();
    await p3.keyboard.press('Control+z');
    await expect.poll(name).toBe('candidate 2');
    await p3.keyboard.press('Control+Shift+z');
    await expect.poll(name).toBe('stairs');
    await p3.keyboard.press('Control+z');
    await expect.poll(name).toBe('candidate 2');
    await p3.keyboard.press('Control+y');
    await expect.poll(name).toBe('stairs');
    await p3.screenshot({ path: join(OUTPUT, 'study-restored.png') });

    // Export: browser mode downloads the files as one ZIP (browsers drop bursts of downloads).
    await p3.getByRole('button', { name: 'Export…' }).click();
    await p3.screenshot({ path: join(OUTPUT, 'study-export-dialog.png') });
    const [zip] = await Promise.all([p3.waitForEvent('download'), p3.getByRole('button', { name: 'Download ZIP' }).click()]);
    expect(zip.suggestedFilename()).toBe('windows-export.zip');
    const zipPath = join(h.tempDir, 'export.zip');
    await zip.saveAs(zipPath);
    // Unpacked with the app's own ZIP reader (src/core/study/zip.ts, tested on its own in test/core).
    const byName = new Map(readZip(new Uint8Array(readFileSync(zipPath))).map((e) => [e.name, Buffer.from(e.data)]));
    for (const name of ['windows-weak-labels.csv', 'windows-provenance.json', 'windows-label-first.csv', 'windows-events.tsv', 'windows-map.svg', 'windows-map.png', 'windows-report.html']) {
      expect(byName.has(name), `${name} in ${[...byName.keys()].join(', ')}`).toBe(true);
    }
    expect([...byName.keys()].some((n) => n.endsWith('.edf'))).toBe(true);
    const read = async (name: string) => byName.get(name)!;
    const rows = (await read('windows-weak-labels.csv')).toString('utf8').split(/\r?\n/).filter((l) => l.length > 0).map((l) => l.split(','));
    const header = rows.shift()!;
    const [cl, cn, sa] = ['cluster', 'class_name', 'set_aside'].map((c) => header.indexOf(c));
    expect(rows).toHaveLength(DEMO_WINDOWS);
    rows.forEach((r, i) => {
      expect(Number(r[cl])).toBe(restored.labels[i] + 1); // numbered index + 1, as on screen
      expect(r[sa]).toBe(restored.labels[i] === 2 ? '1' : '0');
      expect(r[cn]).toBe(restored.labels[i] === 0 ? 'walking' : restored.labels[i] === 1 ? 'stairs' : '');
    });
    // PNG signature (PNG specification, ISO/IEC 15948, section 5.2).
    expect([...(await read('windows-map.png')).subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    writeFileSync(join(OUTPUT, 'study-export-map.png'), await read('windows-map.png'));
    writeFileSync(join(OUTPUT, 'study-export-map.svg'), await read('windows-map.svg'));
    writeFileSync(join(OUTPUT, 'study-export-report.html'), await read('windows-report.html'));
    const svg = (await read('windows-map.svg')).toString('utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('walking');
    const report = (await read('windows-report.html')).toString('utf8');
    expect(report).toContain('walking');
    expect(report).toContain('<svg');
  });
});
