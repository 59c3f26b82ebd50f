import { describe, expect, it } from 'vitest';
import { DEFAULT_SEED, simulateStudy } from '../../../demo-data/generate';
import { ACTIVITIES } from '../../../demo-data/sim/activities';
import { rawEdf } from '../../../demo-data/sim/edf';
import { rawCsv, windowsOf } from '../../../demo-data/sim/tables';
import { bytesSource } from '../../../src/core/raw/byte-source';
import { openRawCsv } from '../../../src/core/raw/csv/read';
import { openEdf } from '../../../src/core/raw/edf/read';
import { linkWindows } from '../../../src/core/raw/link';

describe('demo generator EDF+ (demo-data/sim/edf.ts)', () => {
  it('round-trips: the EDF and the raw CSV of a volunteer give the same samples for every window, with an annotation per activity bout', async () => {
    const rec = simulateStudy(DEFAULT_SEED).next().value!;
    const edf = await openEdf(bytesSource(rawEdf(rec)), `${rec.volunteer.id}.edf`);
    const csv = await openRawCsv(bytesSource(new TextEncoder().encode(rawCsv(rec))), `${rec.volunteer.id}.csv`);
    expect(edf.header.format).toBe('EDF+D');
    expect(edf.startEpoch).toBe(rec.segmentEpochs[0]);
    expect(edf.channels.map((c) => [c.label, c.unit, c.rate])).toEqual([
      ['acc_x', 'g', 50], ['acc_y', 'g', 50], ['acc_z', 'g', 50], ['gyr_x', 'deg/s', 50], ['gyr_y', 'deg/s', 50], ['gyr_z', 'deg/s', 50],
    ]);
    expect(edf.coverage).toEqual(csv.coverage);

    // One annotation per run of one activity inside a worn stretch.
    let runs = 0;
    for (const s of rec.segments) {
      for (let i = s.start; i < s.end; i++) if (i === s.start || rec.activity[i] !== rec.activity[i - 1]) runs++;
    }
    const notes = await edf.annotations();
    expect(notes.length).toBe(runs);
    expect(notes.every((a) => (ACTIVITIES as readonly string[]).includes(a.text) && a.duration! > 0)).toBe(true);
    expect(notes[0]).toMatchObject({ onset: 0, text: ACTIVITIES[rec.activity[0]] });

    const windows = windowsOf(rec).map((w) => ({ id: w.id, subject: w.subject, start: w.start, end: w.end }));
    const fromEdf = await linkWindows(windows, { pattern: '{subject}.edf' }, async () => edf);
    const fromCsv = await linkWindows(windows, { pattern: '{subject}.csv' }, async () => csv);
    expect(fromEdf.filter((l) => !l.ok)).toEqual([]);
    expect(fromCsv.filter((l) => !l.ok)).toEqual([]);
    const worst = [0, 0, 0, 0, 0, 0];
    for (const k of [0, 1, Math.floor(windows.length / 2), windows.length - 1]) {
      const a = fromEdf[k];
      const b = fromCsv[k];
      if (!a.ok || !b.ok) throw new Error('unlinked');
      const [sa, sb] = [await a.source.readSpan(a.start, a.end), await b.source.readSpan(b.start, b.end)];
      sa.channels.forEach((c, j) => {
        expect(c.samples.length).toBe(250);
        expect(c.t0).toBeCloseTo(sb.channels[j].t0, 6);
        c.samples.forEach((v, i) => (worst[j] = Math.max(worst[j], Math.abs(v - sb.channels[j].samples[i]))));
      });
    }
    // One digital step is the sensor resolution the CSV prints (1e-4 g, 0.01 deg/s): values agree to float32 precision.
    worst.forEach((w, j) => expect(w).toBeLessThan(j < 3 ? 1e-6 : 1e-4));
  });
});
