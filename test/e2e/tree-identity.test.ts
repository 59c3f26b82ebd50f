/**
 * End to end, browser mode: identities survive a re-cut of the Tree. A Ward run of the demo study
 * at 8 clusters; cluster 3 is named and given a colour; the cut is dragged to 12 clusters (k shown
 * on the Tree and in the status bar during the drag) and stepped back to 8 with the arrow keys; a
 * cluster named at 12 comes back with its name when the cut returns to 12. After each cut the
 * exported weak labels (Export dialog) hold, for every row of the cluster list, exactly that many
 * windows under the same number and name, and `gleaner run` on the saved study writes the same weak
 * labels byte for byte. Reads the demo study from demo-data/.
 */
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZip } from '../../src/core/study/zip';
import { openThroughChooser, OUTPUT, ROOT, startHarness, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');

type Hook = { windows: number; treeBranches: number; clusterName(c: number): string; clusterColour(c: number): string };

interface Row { number: number; name: string; size: number }

/** The cluster list as shown: number, name (the typed class name, else the placeholder) and size of every row. */
function listRows(page: Page): Promise<Row[]> {
  return page.locator('section[aria-labelledby="clusters-title"] li').evaluateAll((lis) => lis.map((li) => {
    const input = li.querySelector<HTMLInputElement>('input[type="text"]')!;
    return {
      number: Number(li.querySelector('.n')!.textContent),
      name: input.value || input.placeholder,
      size: Number(li.querySelector('.size')!.textContent!.replace(/,/g, '')), // thousands separators
    };
  }));
}

/** RFC 4180 fields of one CSV line (quoted fields may hold commas and doubled quotes). */
function csvFields(line: string): string[] {
  const out: string[] = [];
  let field = '', quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') { field += '"'; i++; } else if (ch === '"') quoted = false; else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') { out.push(field); field = ''; } else field += ch;
  }
  out.push(field);
  return out;
}

/** Exports through the Export dialog and counts the weak labels' windows by (cluster number, cluster name). */
async function exportedCounts(h: Harness, tag: string): Promise<Row[]> {
  return (await exported(h, tag)).counts;
}

async function exported(h: Harness, tag: string): Promise<{ counts: Row[]; bytes: Uint8Array }> {
  const { page } = h;
  await page.getByRole('button', { name: 'Export…' }).click();
  const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
  const zipPath = join(h.tempDir, `export-${tag}.zip`);
  await zip.saveAs(zipPath);
  const entry = readZip(new Uint8Array(readFileSync(zipPath))).find((e) => e.name === 'windows-weak-labels.csv');
  expect(entry, 'windows-weak-labels.csv in the export').toBeDefined();
  const lines = new TextDecoder().decode(entry!.data).split(/\r?\n/).filter((l) => l !== '');
  const header = csvFields(lines[0]);
  const cn = header.indexOf('cluster'), nn = header.indexOf('cluster_name');
  expect(cn).toBeGreaterThanOrEqual(0);
  expect(nn).toBeGreaterThanOrEqual(0);
  const counts = new Map<string, Row>();
  for (const line of lines.slice(1)) {
    const f = csvFields(line);
    const key = `${f[cn]}\u0000${f[nn]}`;
    const row = counts.get(key) ?? { number: Number(f[cn]), name: f[nn], size: 0 };
    row.size++;
    counts.set(key, row);
  }
  return { counts: [...counts.values()].sort((a, b) => a.number - b.number), bytes: entry!.data };
}

const byNumber = (rows: Row[]) => [...rows].sort((a, b) => a.number - b.number);
const hookOf = (page: Page) => page.evaluate(() => {
  const g = (window as unknown as { __gleaner: Hook }).__gleaner;
  return { name: g.clusterName(2), colour: g.clusterColour(2) };
});

describe('identities across tree re-cuts, end to end', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('keeps a named cluster\'s name, number and colour from 8 to 12 clusters and back, and the export agrees with the list', async () => {
    const { page } = h;
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.goto(h.url);
    await openThroughChooser(page, DEMO);
    await page.waitForFunction(() => (window as unknown as { __gleaner: Hook }).__gleaner.windows > 0, undefined, { timeout: 60_000 });
    await page.locator('#param-cluster').selectOption('ward');
    await page.getByLabel('Clusters (k)').fill('8');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);

    // Name cluster 3 and give it a colour of its own.
    await page.getByLabel('Name of cluster 3').fill('walking');
    await page.getByLabel('Name of cluster 3').press('Enter');
    await page.getByLabel('Edit cluster 3').click();
    // The first chip whose colour no cluster up to number 16 has from the palette.
    const chips = page.getByRole('group', { name: 'Colour of cluster 3' }).locator('button');
    const used = await page.evaluate(() => Array.from({ length: 16 }, (_, c) => (window as unknown as { __gleaner: Hook }).__gleaner.clusterColour(c).toLowerCase()));
    const hexes = (await chips.evaluateAll((bs) => bs.map((b) => b.getAttribute('aria-label')!.replace('Colour ', '').toLowerCase())));
    const pick = hexes.findIndex((hex) => !used.includes(hex));
    expect(pick).toBeGreaterThanOrEqual(0);
    const chip = chips.nth(pick);
    const CHOSEN = hexes[pick];
    expect((await hookOf(page)).colour).not.toBe(CHOSEN);
    await chip.click();
    await page.getByLabel('Edit cluster 3').click();
    const at8 = byNumber(await listRows(page));
    expect(at8.length).toBe(8);
    const walking8 = at8.find((r) => r.number === 3)!;
    expect(walking8.name).toBe('walking');
    expect(await hookOf(page)).toEqual({ name: 'walking', colour: CHOSEN });
    expect(await exportedCounts(h, 'k8')).toEqual(at8);

    // Drag the cut 45 px towards the leaves: 4 merges at the normal rate (10 px a merge) → 12.
    await page.getByRole('tab', { name: 'Tree' }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: Hook }).__gleaner.treeBranches > 0, undefined, { timeout: 30_000 });
    const canvas = page.locator('canvas[data-cut-at]');
    const box = (await canvas.boundingBox())!;
    const cutY = Number(await canvas.getAttribute('data-cut-at'));
    const x = box.x + box.width * 0.5;
    await page.mouse.move(x, box.y + cutY);
    await page.mouse.down();
    for (let i = 1; i <= 9; i++) await page.mouse.move(x, box.y + cutY + 5 * i);
    // While the button is still down the Tree and the status bar say the same k.
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe('12');
    expect(await page.getByTestId('status').textContent()).toContain('Tree cut into 12 clusters');
    await page.screenshot({ path: join(OUTPUT, 'tree-identity-drag.png') });
    await page.mouse.up();
    await expect.poll(() => page.getByText('updating confidence').count(), { timeout: 30_000 }).toBe(0);
    await expect.poll(() => page.getByTestId('status').textContent()).toContain('Tree cut into 12 clusters');

    const at12 = byNumber(await listRows(page));
    expect(at12.length).toBe(12);
    // The eight numbers stay; four new ones follow the previous maximum (9..12).
    expect(at12.map((r) => r.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    const walking12 = at12.find((r) => r.number === 3)!;
    expect(walking12.name).toBe('walking');
    expect(walking12.size).toBeLessThanOrEqual(walking8.size);
    expect(await hookOf(page)).toEqual({ name: 'walking', colour: CHOSEN });
    // A cluster that did not split keeps its size; every window of the run is in one row.
    expect(at12.reduce((s, r) => s + r.size, 0)).toBe(at8.reduce((s, r) => s + r.size, 0));
    expect(await exportedCounts(h, 'k12')).toEqual(at12);

    // Name a new cluster at 12, then step back to 8 with the arrow keys (one merge per key).
    await page.getByLabel('Name of cluster 10').fill('resting');
    await page.getByLabel('Name of cluster 10').press('Enter');
    const named12 = byNumber(await listRows(page));
    expect(named12.find((r) => r.number === 10)!.name).toBe('resting');
    await canvas.focus();
    for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowUp');
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe('8');
    await expect.poll(() => page.getByText('updating confidence').count(), { timeout: 30_000 }).toBe(0);
    const back8 = byNumber(await listRows(page));
    expect(back8.length).toBe(8);
    expect(back8.find((r) => r.number === 3)).toEqual(walking8);
    expect(await hookOf(page)).toEqual({ name: 'walking', colour: CHOSEN });
    // Every window is listed once, and the export says what the list says.
    expect(back8.reduce((s, r) => s + r.size, 0)).toBe(walking8.size + at8.filter((r) => r.number !== 3).reduce((s, r) => s + r.size, 0));
    expect(await exportedCounts(h, 'back8')).toEqual(back8);
    await page.screenshot({ path: join(OUTPUT, 'tree-identity-back8.png') });

    // One merge more (7 clusters): the merged cluster keeps the larger one's number, the other
    // number is left out (a gap, not a renumbering), and the export still agrees with the list.
    await canvas.focus();
    await page.keyboard.press('ArrowUp');
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe('7');
    await expect.poll(() => page.getByText('updating confidence').count(), { timeout: 30_000 }).toBe(0);
    const at7 = byNumber(await listRows(page));
    expect(at7.length).toBe(7);
    const gone = back8.filter((r) => !at7.some((x) => x.number === r.number));
    expect(gone.length).toBe(1);
    const grown = at7.filter((r) => r.size !== back8.find((x) => x.number === r.number)!.size);
    expect(grown.length).toBe(1);
    expect(grown[0].size).toBe(back8.find((x) => x.number === grown[0].number)!.size + gone[0].size);
    expect(gone[0].size).toBeLessThanOrEqual(back8.find((x) => x.number === grown[0].number)!.size);
    expect(await exportedCounts(h, 'k7')).toEqual(at7);
    await canvas.focus();
    await page.keyboard.press('ArrowDown');
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe('8');
    await expect.poll(() => page.getByText('updating confidence').count(), { timeout: 30_000 }).toBe(0);
    expect(byNumber(await listRows(page))).toEqual(back8);

    // A curation change at 8 (a description) makes the 8 clusters the ones the next cut starts from;
    // down to 12 again (four keys): the clusters merged away come back whole, with their names and
    // numbers ("resting" among them), so the list is the one at 12 again.
    await page.getByLabel('Edit cluster 1').click();
    await page.getByLabel('Description of cluster 1').fill('checked at 8');
    await page.getByLabel('Description of cluster 1').press('Tab');
    await page.getByLabel('Edit cluster 1').click();
    await canvas.focus();
    for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowDown');
    await expect.poll(() => page.getByTestId('tree-k').textContent()).toBe('12');
    await expect.poll(() => page.getByText('updating confidence').count(), { timeout: 30_000 }).toBe(0);
    const again12 = byNumber(await listRows(page));
    expect(again12).toEqual(named12);
    expect(again12.find((r) => r.number === 3)).toEqual(walking12);
    expect(await hookOf(page)).toEqual({ name: 'walking', colour: CHOSEN });
    const last = await exported(h, 'again12');
    expect(last.counts).toEqual(again12);

    // The saved study replays to the same weak labels in `gleaner run`, which cuts the tree again.
    const dir = join(h.tempDir, 'cli');
    mkdirSync(dir, { recursive: true });
    const studyPath = join(dir, 'windows.gleaner');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /^Save/ }).first().click()]);
    await download.saveAs(studyPath);
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    const out = join(dir, 'out');
    execFileSync('node', ['--import', 'tsx', 'src/cli/main.ts', 'run', studyPath, '--out', out, '--progress', 'none'], { cwd: ROOT, stdio: 'pipe' });
    const runs = readdirSync(out);
    expect(runs).toHaveLength(1);
    const cli = readFileSync(join(out, runs[0], 'windows-weak-labels.csv'));
    expect(cli.equals(Buffer.from(last.bytes)), "the app's and gleaner run's weak labels differ").toBe(true);
    expect(h.pageErrors).toEqual([]);
  });
});
