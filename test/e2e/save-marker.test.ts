/**
 * End to end, browser mode: the save marker tells the truth. The demo study opens clean (its first
 * run is part of opening it); any change marks it; Ctrl+S (or Save) clears the mark and it stays
 * clear; undo is a change.
 */
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OUTPUT, startHarness, waitForRuns, type Harness } from './harness';

const saveLabel = (page: Page) => page.getByRole('button', { name: /^Save( •)?$/ }).textContent();

describe('the save marker', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h?.close();
  });

  it('is clean on open and after save, dirty after a change', async () => {
    const { page } = h;
    await page.goto(h.url);
    await page.getByRole('button', { name: 'Load the demo study' }).click();
    await waitForRuns(page, 1);
    await expect.poll(() => saveLabel(page)).toBe('Save');

    await page.getByLabel('Name of cluster 1').fill('walking');
    await page.getByLabel('Name of cluster 1').press('Enter');
    await expect.poll(() => saveLabel(page)).toBe('Save •');
    await page.screenshot({ path: join(OUTPUT, 'save-marker-dirty.png') });

    await page.locator('.brand').click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Control+s')]);
    await download.saveAs(join(h.tempDir, 'demo.gleaner'));
    await expect.poll(() => page.locator('footer').textContent()).toMatch(/Saved the study/);
    await expect.poll(() => saveLabel(page)).toBe('Save');
    // Nothing flips it back by itself (autosave, view redraws): still clean a few seconds on.
    await page.waitForTimeout(3000);
    expect(await saveLabel(page)).toBe('Save');

    // Undo is a change too; redo brings back the saved state, which is a change from the undone one.
    await page.keyboard.press('Control+z');
    await expect.poll(() => saveLabel(page)).toBe('Save •');
    expect(h.pageErrors).toEqual([]);
  });
});
