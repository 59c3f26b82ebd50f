/**
 * Golden outputs of the app (browser mode): the files "Save" and the Export dialog write for a
 * curated k-means run of the demo study, and the Export dialog's weak labels and provenance for a
 * t-SNE run set up in the run panel, must stay byte-identical to test/fixtures/golden/app-*
 * (GLEANER_GOLDEN_WRITE=1 rewrites them). Masked, because they hold the wall clock: the export
 * time (`createdAt` of the provenance, the same time in the report), the run's time stamped when
 * the study document is built (`runCreatedAt`), and each run's `createdAt` in the saved study.json. ZIP containers (the study file, the export bundle) are compared
 * entry by entry, each entry's bytes in full.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Download, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZip } from '../../src/core/study/zip';
import { checkGolden, maskText, type Outputs } from '../golden/store';
import { ROOT, startHarness, waitForRuns, type Harness, openAndWait } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const ISO = /\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z/;

async function bytesOf(d: Download, dir: string): Promise<Buffer> {
  const path = join(dir, `dl-${Math.random().toString(36).slice(2)}`);
  await d.saveAs(path);
  return readFileSync(path);
}

/**
 * Clock times masked in the text files of one export: the export time (provenance `createdAt`,
 * also in the report) and the run's time (`runCreatedAt`, stamped when the app builds the study
 * document). The demo data hold no ISO 8601 times of their own (times are epoch seconds).
 */
function maskExportTime(files: Outputs): Outputs {
  const prov = [...files].find(([n]) => n.endsWith('provenance.json'));
  const time = prov ? (JSON.parse(prov[1].toString('utf8')) as { createdAt: string }).createdAt : '';
  expect(time).toMatch(ISO);
  const out: Outputs = new Map();
  for (const [name, data] of files) out.set(name, /\.(json|html|csv|tsv|svg)$/.test(name) ? maskText(data, [[new RegExp(ISO.source, 'g'), '<clock time>']]) : data);
  return out;
}

function unzip(prefix: string, bytes: Buffer): Outputs {
  return new Map(readZip(new Uint8Array(bytes)).map((e) => [`${prefix}/${e.name}`, Buffer.from(e.data)]));
}

async function rename(page: Page, c: number, name: string): Promise<void> {
  await page.getByLabel(`Name of cluster ${c + 1}`).fill(name);
  await page.getByLabel(`Name of cluster ${c + 1}`).press('Enter');
  await page.locator('.brand').click();
}

/** The Export dialog's ZIP (browser mode), its entries under `prefix/`, clock times masked. */
async function exportDialog(page: Page, dir: string, prefix: string): Promise<Outputs> {
  await page.getByRole('button', { name: 'Export…' }).click();
  const [zip] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ZIP' }).click()]);
  expect(zip.suggestedFilename()).toBe('windows-export.zip');
  return maskExportTime(unzip(prefix, await bytesOf(zip, dir)));
}

describe('golden outputs of the app', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('a curated k-means run: Save and the Export dialog write the golden bytes', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openAndWait(page, DEMO);
    await page.getByLabel('Clusters (k)').fill('6');
    await page.getByLabel('Seed').fill('4');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 1);
    await rename(page, 0, 'walking');
    await page.getByLabel('Edit cluster 3').click();
    await page.getByLabel('Set aside cluster 3').check();
    await page.getByLabel('Select cluster 4').check();
    await page.getByLabel('Select cluster 5').check();
    await page.getByRole('button', { name: 'Merge 2 ticked' }).click();

    const outputs: Outputs = new Map();

    const [saved] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /^Save/ }).first().click()]);
    expect(saved.suggestedFilename()).toBe('windows.gleaner');
    for (const [name, data] of unzip('study', await bytesOf(saved, h.tempDir))) {
      outputs.set(name, name.endsWith('.json') ? maskText(data, [[new RegExp(`"createdAt": "${ISO.source}"`, 'g'), '"createdAt": "<masked>"']]) : data);
    }

    for (const [name, data] of await exportDialog(page, h.tempDir, 'export-dialog')) outputs.set(name, data);

    expect(checkGolden('app/curated-kmeans', outputs)).toEqual([]);
    expect(h.pageErrors).toEqual([]);
  });

  it('a t-SNE run set in the run panel (perplexity, iterations, k): the exported weak labels and provenance keep the golden bytes', async () => {
    const { page } = h;
    await page.locator('#param-embed').selectOption('tsne');
    await page.getByLabel('Perplexity').fill('25');
    await page.getByLabel('Iterations').fill('250');
    await page.getByLabel('Clusters (k)').fill('5');
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await waitForRuns(page, 2, 300_000);
    const files = await exportDialog(page, h.tempDir, 'export');
    const kept: Outputs = new Map([...files].filter(([n]) => /-(weak-labels\.csv|provenance\.json)$/.test(n)));
    expect(kept.size).toBe(2);
    expect(checkGolden('app/tsne-panel', kept)).toEqual([]);
    expect(h.pageErrors).toEqual([]);
  });
});
