import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bytesSource } from '../../src/core/raw/byte-source';
import { openEdf } from '../../src/core/raw/edf/read';
import { ROOT, runCli, tempDir } from './run-cli';

const DEMO = join(ROOT, 'demo-data/windows.csv');

describe('gleaner analyze --events', () => {
  it('writes a BIDS events.tsv and per-subject EDF+ annotation files that agree with each other and with windows.csv', async () => {
    const out = tempDir('events');
    const r = runCli(['analyze', DEMO, '--k', '4', '--restarts', '1', '--seed', '3', '--events', '--progress', 'none', '--out', out]);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);

    const lines = readFileSync(join(out, 'events.tsv'), 'utf8').split('\n');
    expect(lines.pop()).toBe(''); // every line ends with a newline
    const rows = lines.map((l) => l.split('\t'));
    const header = rows.shift()!;
    // BIDS specification 1.9, "Modality agnostic files" → "Task events": onset, duration (seconds) first,
    // trial_type optional; "Common principles" → tabular files: tab-separated, "n/a" for missing values.
    expect(header.slice(0, 3)).toEqual(['onset', 'duration', 'trial_type']);
    for (const row of rows) {
      expect(row).toHaveLength(header.length);
      expect(Number(row[0])).toBeGreaterThanOrEqual(0);
      expect(Number(row[1])).toBeGreaterThan(0);
      expect(row).not.toContain('');
      expect(row[header.indexOf('class_name')]).toBe('n/a'); // nothing named yet: all candidates
    }
    // Every window with a time lands in exactly one segment (nothing is set aside after analyze).
    const windows = readFileSync(join(out, 'windows.csv'), 'utf8').trim().split('\n').length - 1;
    expect(rows.reduce((s, row) => s + Number(row[header.indexOf('n_windows')]), 0)).toBe(windows);

    const edfs = readdirSync(out).filter((f) => f.endsWith('.edf')).sort();
    const subjects = [...new Set(rows.map((row) => row[header.indexOf('subject')]))].sort();
    expect(edfs).toEqual(subjects.map((s) => `sub-${s}_ses-morning_annotations.edf`));
    for (const name of edfs) {
      const edf = await openEdf(bytesSource(new Uint8Array(readFileSync(join(out, name)))), name);
      expect(edf.header.format).toBe('EDF+C'); // Kemp & Olivan 2003, EDF+ section 2.1.3
      const mine = rows.filter((row) => `sub-${row[header.indexOf('subject')]}_ses-morning_annotations.edf` === name);
      const read = await edf.annotations();
      expect(read.map((a) => [a.onset, a.duration, a.text])).toEqual(mine.map((row) => [Number(row[0]), Number(row[1]), row[2]]));
      // The demo's start column holds epoch seconds (2026): the EDF header starts at the subject's first window.
      expect(edf.startEpoch).toBe(Number(mine[0][header.indexOf('origin')]));
    }
  });

  it('fails before the long run when the table has no start times', () => {
    const dir = tempDir('events-nostart');
    const input = join(dir, 'w.csv');
    const text = readFileSync(DEMO, 'utf8').split('\n').slice(0, 50).map((l) => l.split(',').filter((_, j) => j !== 3 && j !== 4).join(',')).join('\n');
    writeFileSync(input, text);
    const r = runCli(['analyze', input, '--k', '2', '--events', '--out', join(dir, 'out')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^gleaner: invalid events: .*start column/);
  });
});
