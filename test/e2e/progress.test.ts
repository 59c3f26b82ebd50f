/**
 * End to end, browser mode: the status bar tells the truth while a t-SNE run with sample-then-place
 * runs on the demo study. Every text the status bar shows is recorded in the page (a
 * MutationObserver, so a stage shown for a moment is not missed), and the bar is also sampled
 * every ~300 ms for its elapsed time.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hookState, ROOT, startWithTable, waitForRuns, type Harness } from './harness';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const DEMO_WINDOWS = readFileSync(DEMO, 'utf8').split(/\r?\n/).filter((l) => l.length > 0).length - 1;
/** The run panel's smallest "Sample above": that many windows are embedded, the rest placed. */
const SAMPLE = 1000;
const PLACED = DEMO_WINDOWS - SAMPLE;

interface Seen { t: number; text: string }

/** "embedding · t-SNE · iteration 12 / 2500 · 1 min 04 s elapsed" → its stage and elapsed seconds. */
function parse(text: string): { stage: string; elapsed: number | null } {
  const m = /(?:(\d+) min )?(\d+) s elapsed/.exec(text);
  return { stage: text.split(' · ')[0], elapsed: m ? Number(m[1] ?? 0) * 60 + Number(m[2]) : null };
}

describe('browser mode: progress that tells the truth', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startWithTable(DEMO, DEMO_WINDOWS);
  });
  afterAll(async () => {
    await h?.close();
  });

  it('t-SNE with placing: stages named in order, elapsed ticking, no earlier stage\'s counter later', async () => {
    const { page } = h;
    await page.getByLabel('Embedding').selectOption('tsne');
    // 2,500 iterations on the 1,000-window sample: a run of several seconds, long enough to watch.
    await page.getByLabel('Iterations').fill('2500');
    await page.getByLabel('Sample above').fill(String(SAMPLE));
    // Record every text of the stage line, with the page's clock.
    await page.evaluate(() => {
      const w = window as unknown as { __seen: Seen[] };
      w.__seen = [];
      let last = '';
      const record = () => {
        const text = document.querySelector('[data-testid="status-stage"]')?.textContent ?? '';
        if (text !== '' && text !== last) w.__seen.push({ t: performance.now(), text });
        last = text;
      };
      new MutationObserver(record).observe(document.querySelector('footer')!, { subtree: true, childList: true, characterData: true });
    });
    await page.getByRole('button', { name: 'Run', exact: true }).click();
    await page.waitForFunction(() => (window as unknown as { __gleaner: { busy: boolean } }).__gleaner.busy, null, { timeout: 10_000 });

    const sampled: Seen[] = [];
    for (let i = 0; i < 2000; i++) {
      const s = await page.evaluate(() => ({
        t: performance.now(),
        busy: (window as unknown as { __gleaner: { busy: boolean } }).__gleaner.busy,
        text: document.querySelector('[data-testid="status-stage"]')?.textContent ?? '',
      }));
      if (!s.busy) break;
      if (s.text) sampled.push({ t: s.t, text: s.text });
      await page.waitForTimeout(300);
    }
    await waitForRuns(page, 1, 180_000);
    const seen = await page.evaluate(() => (window as unknown as { __seen: Seen[] }).__seen);
    const span = (sampled[sampled.length - 1].t - sampled[0].t) / 1000;
    console.log(`progress: ${seen.length} status texts, ${sampled.length} samples over ${span.toFixed(1)} s; stages ${[...new Set(seen.map((s) => parse(s.text).stage))].join(', ')}`);

    // Every stage of this run is named, in order ("starting" until the worker's first report).
    const order = seen.map((s) => parse(s.text).stage).filter((s, i, all) => all.indexOf(s) === i);
    expect(order).toEqual(['starting', 'scaling', 'embedding', 'placing', 'quality', 'clustering', 'silhouette']);
    // The embedding counts t-SNE iterations; placing has its own counter of windows.
    expect(seen.some((s) => /^embedding · t-SNE · iteration \d+ \/ 2500/.test(s.text))).toBe(true);
    const placing = seen.filter((s) => parse(s.text).stage === 'placing');
    expect(placing.every((s) => new RegExp(`^placing · [\\d,]+ / ${PLACED.toLocaleString('en')} windows · `).test(s.text)), placing.map((s) => s.text).join('\n')).toBe(true);
    // No earlier stage's sub-label in a later one.
    const stale = seen.filter((s) => parse(s.text).stage !== 'embedding' && /iteration|epoch|cost|t-SNE/.test(s.text));
    expect(stale.map((s) => s.text)).toEqual([]);
    // Every text says how long the run has taken.
    expect(seen.every((s) => parse(s.text).elapsed !== null)).toBe(true);

    // Elapsed time moves on its own: the figure ticks once a second whether or not a report arrives
    // (quality, for one, sends a single report and runs for seconds). Any two samples 2.5 s apart
    // show a larger figure: 1 s between ticks, up to 1 s more from rounding to whole seconds, and
    // half a second for timers running late on a loaded 2-core machine.
    expect(span).toBeGreaterThanOrEqual(3);
    const late: string[] = [];
    for (let i = 0; i < sampled.length; i++) {
      for (let j = i + 1; j < sampled.length; j++) {
        if (sampled[j].t - sampled[i].t < 2500) continue;
        if (!(parse(sampled[j].text).elapsed! > parse(sampled[i].text).elapsed!)) late.push(`${sampled[i].text}  →  ${sampled[j].text}`);
        break;
      }
    }
    expect(late).toEqual([]);
    // The time left is shown only after the first 5 seconds (core/progress/eta.ts).
    for (const s of seen) if (/left$/.test(s.text)) expect(parse(s.text).elapsed!, s.text).toBeGreaterThanOrEqual(5);

    expect((await hookState(page)).pointsDrawn).toBe(DEMO_WINDOWS);
    expect(h.pageErrors).toEqual([]);
  });
});
