/**
 * End to end, browser mode: what the cluster list shows is what the export says. After each
 * curation step (rename, merge, split, set aside) and after a tree re-cut, the Export dialog's
 * weak labels, events and report are read beside the list: every row shown holds exactly as many
 * windows under the same number and name in the weak labels, set-aside rows export set_aside = 1,
 * flags agree, and the counts shown equal the rows shown. Reads the demo windows from demo-data/.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZip } from '../../src/core/study/zip';
import { OUTPUT, ROOT, startHarness, waitForRuns, type Harness, openAndWait } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;

interface ShownRow { number: number; name: string; size: number; setAside: boolean; flags: string[] }

const rowsLocator = (page: Page) => page.locator('li:has(input[aria-label^="Name of cluster"])');

/** The cluster list as a researcher reads it: number, name (typed class or the placeholder), size, tags. */
async function shownRows(page: Page): Promise<ShownRow[]> {
  return rowsLocator(page).evaluateAll((lis) => lis.map((li) => {
    const input = li.querySelector<HTMLInputElement>('input[type="text"]')!;
    return {
      number: Number(li.querySelector('.n')!.textContent!.trim()),
      name: input.value || input.placeholder,
      size: Number(li.querySelector('.size')!.textContent!.replace(/[^0-9]/g, '')),
      setAside: li.querySelector('.tag')?.textContent === 'set aside',
      flags: [...li.querySelectorAll('.flag')].map((f) => (f.textContent ?? '').replace(/^⚑\s*/, '').split(':')[0].trim()),
    };
  }));
}

/** A CSV line split on commas; the names used here hold no comma or quote (checked). */
function cells(line: string): string[] {
  if (line.includes('"')) throw new Error(`unexpected quoted cell in ${line}`);
  return line.split(',');
}

/** Exports through the dialog (one ZIP in browser mode) and returns its files by name. */
async function exportAll(page: Page, h: Harness, step: string): Promise<Map<string, Buffer>> {
  await page.getByRole('button', { name: 'Export…' }).click();
  for (const label of ['Map as SVG', 'Map as PNG', /Figures of the views/]) {
    const box = page.getByLabel(label);
    if (await box.isChecked()) await box.uncheck();
  }
  const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
  const path = join(h.tempDir, `export-${step}.zip`);
  await zip.saveAs(path);
  return new Map(readZip(new Uint8Array(readFileSync(path))).map((e) => [e.name, Buffer.from(e.data)]));
}

/** The screen against the files, after one step. */
async function screenEqualsExport(page: Page, h: Harness, step: string): Promise<ShownRow[]> {
  const shown = await shownRows(page);
  // The counts shown equal the rows shown, and the sizes add up to the analysed windows.
  const meta = (await page.locator('p.meta').textContent()) ?? '';
  expect(meta, step).toContain(`${shown.length} clusters`);
  expect(shown.reduce((s, r) => s + r.size, 0), step).toBe(DEMO_WINDOWS);
  expect(new Set(shown.map((r) => r.number)).size, step).toBe(shown.length);

  const files = await exportAll(page, h, step);
  const lines = files.get('windows-weak-labels.csv')!.toString('utf8').trimEnd().split('\n');
  const header = cells(lines[0]);
  const col = (name: string) => header.indexOf(name);
  const [cl, cn, cls, sa, fl] = ['cluster', 'cluster_name', 'class_name', 'set_aside', 'flags'].map(col);
  expect(Math.min(cl, cn, cls, sa, fl), header.join(',')).toBeGreaterThanOrEqual(0);
  const exported = new Map<number, { name: string; className: string; setAside: string; flags: string; windows: number }>();
  for (const line of lines.slice(1)) {
    const r = cells(line);
    const n = Number(r[cl]);
    const e = exported.get(n);
    if (e) {
      e.windows++;
      // One identity per number: every window of a cluster carries the same name, class, set-aside and flags.
      expect([r[cn], r[cls], r[sa], r[fl]], `${step}: cluster ${n}`).toEqual([e.name, e.className, e.setAside, e.flags]);
    } else {
      exported.set(n, { name: r[cn], className: r[cls], setAside: r[sa], flags: r[fl], windows: 1 });
    }
  }
  expect([...exported.keys()].sort((a, b) => a - b), step).toEqual(shown.map((r) => r.number).sort((a, b) => a - b));
  for (const row of shown) {
    const e = exported.get(row.number)!;
    expect({ name: e.name, windows: e.windows, setAside: e.setAside === '1', flags: e.flags ? e.flags.split('; ') : [] }, `${step}: row ${row.number}`)
      .toEqual({ name: row.name, windows: row.size, setAside: row.setAside, flags: row.flags });
    expect(e.className, `${step}: row ${row.number}`).toBe(row.setAside || row.name.startsWith('candidate ') ? '' : row.name);
  }

  // events.tsv (BIDS): the cluster column holds the shown numbers, trial_type the shown names; no set-aside cluster.
  const events = files.get('windows-events.tsv')!.toString('utf8').trimEnd().split('\n').map((l) => l.split('\t'));
  const [ec, et] = ['cluster', 'trial_type'].map((c) => events[0].indexOf(c));
  const byNumber = new Map(shown.map((r) => [r.number, r]));
  for (const e of events.slice(1)) {
    const row = byNumber.get(Number(e[ec]));
    expect(row, `${step}: events cluster ${e[ec]}`).toBeDefined();
    expect(e[et]).toBe(row!.name);
    expect(row!.setAside).toBe(false);
  }

  // The report's cluster table lists the same rows, by number and name, with the flags.
  const report = files.get('windows-report.html')!.toString('utf8');
  for (const row of shown) {
    expect(report, `${step}: report row ${row.number}`).toMatch(new RegExp(`<tr><td>${row.number}</td><td>(<span[^>]*></span>)?${row.name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}</td>`));
    for (const f of row.flags) expect(report).toContain(f);
  }
  await page.screenshot({ path: join(OUTPUT, `identity-${step}.png`) });
  return shown;
}

async function edit(page: Page, number: number): Promise<void> {
  const button = page.getByLabel(`Edit cluster ${number}`);
  if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
}

describe('one identity per cluster, on screen and in the export', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('agrees row for row after rename, merge, split, set aside and a tree re-cut; the flagged cluster shows its flag', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openAndWait(page, DEMO);
    await page.locator('#param-cluster').selectOption('ward');
    await page.getByLabel('Clusters (k)').fill('8');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);

    // The demo's two loose-watch volunteers form a cluster of their own (DESIGN.md §5): its row is flagged.
    const first = await screenEqualsExport(page, h, 'run');
    expect(first).toHaveLength(8);
    const flagged = first.filter((r) => r.flags.includes('subject-bound'));
    expect(flagged.length).toBeGreaterThanOrEqual(1);
    const flaggedRow = rowsLocator(page).filter({ has: page.locator('.n', { hasText: new RegExp(`^${flagged[0].number}$`) }) });
    await expect(flaggedRow.locator('.flag').first().getAttribute('title')).resolves.toMatch(/effective subjects against/);
    await expect(page.locator('.legend .flag').first().textContent()).resolves.toBe('subject-bound');

    // Rename: the name is the class in every file.
    const plain = first.find((r) => r.flags.length === 0)!;
    await page.getByLabel(`Name of cluster ${plain.number}`).fill('walking');
    await page.getByLabel(`Name of cluster ${plain.number}`).press('Enter');
    const renamed = await screenEqualsExport(page, h, 'rename');
    expect(renamed.find((r) => r.number === plain.number)!.name).toBe('walking');

    // Merge two unnamed clusters: one row fewer; the merged-into number stays.
    const [a, b] = renamed.filter((r) => r.name.startsWith('candidate ')).map((r) => r.number);
    await page.getByLabel(`Select cluster ${a}`).check();
    await page.getByLabel(`Select cluster ${b}`).check();
    await page.getByRole('button', { name: 'Merge 2 ticked' }).click();
    await expect.poll(() => rowsLocator(page).count()).toBe(7);
    // Nothing stale: the silhouette is measured again on the curated clusters (a different figure).
    const runSilhouette = (await page.getByTestId('silhouette').textContent())!;
    await expect.poll(() => page.getByTestId('silhouette').textContent(), { timeout: 60_000 }).toMatch(/^mean silhouette -?\d\.\d\d \(of the curated clusters\)$/);
    expect(runSilhouette).not.toContain('curated');
    const merged = await screenEqualsExport(page, h, 'merge');
    expect(merged.map((r) => r.number)).toContain(a);
    expect(merged.map((r) => r.number)).not.toContain(b);

    // Split the named cluster into 3: it keeps its number and name for its first part.
    await edit(page, plain.number);
    await page.getByLabel(`Split cluster ${plain.number} into`).fill('3');
    await page.getByRole('button', { name: 'Split', exact: true }).click();
    await expect.poll(() => rowsLocator(page).count(), { timeout: 60_000 }).toBe(9);
    const split = await screenEqualsExport(page, h, 'split');
    expect(split.find((r) => r.number === plain.number)!.name).toBe('walking');

    // Set aside one cluster: exported with set_aside = 1 and no class.
    const aside = split.find((r) => r.name.startsWith('candidate '))!;
    await edit(page, aside.number);
    await page.getByLabel(`Set aside cluster ${aside.number}`).check();
    const setAside = await screenEqualsExport(page, h, 'set-aside');
    expect(setAside.find((r) => r.number === aside.number)!.setAside).toBe(true);

    // A tree re-cut: drag the cut towards the leaves; whatever the cut gives, screen and files agree.
    await page.getByRole('tab', { name: 'Tree' }).click();
    const canvas = page.locator('canvas[data-cut-at]');
    await expect.poll(async () => Number(await canvas.getAttribute('data-cut-at')), { timeout: 30_000 }).toBeGreaterThan(0);
    const box = (await canvas.boundingBox())!;
    const cutY = Number(await canvas.getAttribute('data-cut-at'));
    const x = box.x + box.width / 2;
    await page.mouse.move(x, box.y + cutY);
    await page.mouse.down();
    const target = box.y + cutY + (box.height - cutY) * 0.2;
    for (let i = 1; i <= 10; i++) await page.mouse.move(x, box.y + cutY + ((target - box.y - cutY) * i) / 10);
    await page.mouse.up();
    await page.waitForFunction(() => !(window as unknown as { __gleaner: { busy: boolean } }).__gleaner.busy, undefined, { timeout: 60_000 });
    const status = page.locator('footer, [role="status"]').filter({ hasText: /Tree cut into \d+ clusters/ }).first();
    await expect.poll(() => status.textContent(), { timeout: 60_000 }).toMatch(/Tree cut into \d+ clusters/);
    const cutK = Number((await status.textContent())!.match(/Tree cut into (\d+) clusters/)![1]);
    await expect.poll(() => rowsLocator(page).count()).toBe(cutK);
    // The new cut's silhouette is measured, not the old cut's carried over.
    await expect.poll(() => page.getByTestId('silhouette').textContent(), { timeout: 60_000 }).toMatch(/^mean silhouette -?\d\.\d\d$/);
    await screenEqualsExport(page, h, 'recut');
    expect(h.pageErrors).toEqual([]);
  });
});
