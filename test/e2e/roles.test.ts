/**
 * End to end, browser mode: the column roles list has a filter and a bulk change. Filtering the
 * demo's columns by name shows only the matching ones; "set all to ignore" changes exactly those,
 * each telling it was set by the user, and the feature count follows. Reads demo-data/windows.csv.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OUTPUT, ROOT, startHarness, type Harness, openAndWait } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const HEADER = readFileSync(DEMO, 'utf8').split('\n')[0].split(',');

describe('column roles: filter and bulk change', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('filters the list by name and sets every column shown to one role', async () => {
    const { page } = h;
    await page.goto(h.url);
    await openAndWait(page, DEMO);
    const summary = page.locator('#roles-title + p.summary');
    const featuresBefore = Number((await summary.textContent())!.match(/(\d+) features/)![1]);

    const gyr = HEADER.filter((c) => c.toLowerCase().includes('gyr'));
    expect(gyr.length).toBeGreaterThan(1);
    await page.getByLabel('Filter columns by name').fill('gyr');
    const names = await page.locator('section[aria-labelledby="roles-title"] li .name').allTextContents();
    expect(names).toEqual(gyr);
    await page.screenshot({ path: join(OUTPUT, 'roles-filter.png') });

    await page.getByLabel('Role for the columns shown').selectOption('ignore');
    await page.getByRole('button', { name: 'Apply' }).click();
    await expect.poll(async () => Number((await summary.textContent())!.match(/(\d+) features/)![1])).toBe(featuresBefore - gyr.length);
    for (const name of gyr) {
      expect(await page.getByLabel(`Role of ${name}`).inputValue()).toBe('ignore');
    }
    await expect(page.locator('section[aria-labelledby="roles-title"] li .evidence').first().textContent()).resolves.toMatch(/set by you \(was feature\)/);

    // Clearing the filter shows every column again.
    await page.getByLabel('Filter columns by name').fill('');
    await expect.poll(() => page.locator('section[aria-labelledby="roles-title"] li .name').count()).toBe(HEADER.length);
    expect(h.pageErrors).toEqual([]);
  });
});
