import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACTIVITIES } from '../../demo-data/sim/activities';
import { DEFAULT_SEED, DEMO_DIR, generateDemoStudy, parseArgs, simulateStudy } from '../../demo-data/generate';
import type { SimulatedRecording } from '../../demo-data/sim/simulate';
import { rawCsv } from '../../demo-data/sim/tables';
import { contiguousSegments, featurizeImuRecording, FEATURE_NAMES } from '../../src/core/features';
import { readDemoCsv } from './demo-csv';

const META = ['window_id', 'subject', 'session', 'start', 'end', 'device', 'placement', 'activity_label'];
let dirA = '';
let dirB = '';

beforeAll(() => {
  dirA = mkdtempSync(join(tmpdir(), 'gleaner-demogen-a-'));
  dirB = mkdtempSync(join(tmpdir(), 'gleaner-demogen-b-'));
  generateDemoStudy({ outDir: dirA });
  generateDemoStudy({ outDir: dirB });
}, 60_000);

afterAll(() => {
  for (const d of [dirA, dirB]) if (d) rmSync(d, { recursive: true, force: true });
});

describe('generateDemoStudy', () => {
  it('writes identical bytes on every run', () => {
    for (const f of ['windows.csv', 'truth.csv']) {
      expect(readFileSync(join(dirA, f)).equals(readFileSync(join(dirB, f))), f).toBe(true);
    }
  });

  it('matches the committed demo-data (regenerate with `npm run demo-data` after changing the generator)', () => {
    for (const f of ['windows.csv', 'truth.csv']) {
      expect(readFileSync(join(DEMO_DIR, f)).equals(readFileSync(join(dirA, f))), f).toBe(true);
    }
    expect(statSync(join(DEMO_DIR, 'windows.csv')).size).toBeLessThan(10 * 1024 * 1024);
  });

  it('has ≥ 3000 windows of 12 volunteers with the documented columns', () => {
    const { header, rows } = readDemoCsv(join(dirA, 'windows.csv'));
    expect(header).toEqual([...META, ...FEATURE_NAMES]);
    expect(rows.length).toBeGreaterThanOrEqual(3000);
    const subjects = [...new Set(rows.map((r) => r[1]))];
    expect(subjects).toEqual(Array.from({ length: 12 }, (_, i) => `S${String(i + 1).padStart(2, '0')}`));
    const bad: string[] = [];
    const plainNumber = /^-?\d+(\.\d+)?$/;
    for (const r of rows) {
      if (r.length !== header.length) bad.push(`${r[0]}: ${r.length} cells`);
      if (!r[0].startsWith(`${r[1]}-`)) bad.push(`${r[0]}: id does not name subject ${r[1]}`);
      if (Number(r[4]) - Number(r[3]) !== 5) bad.push(`${r[0]}: not 5 s long`);
      r.slice(META.length).forEach((v, j) => {
        if (!plainNumber.test(v)) bad.push(`${r[0]} ${FEATURE_NAMES[j]}: ${v}`);
      });
    }
    expect(bad).toEqual([]);
  });

  it('labels about 4% of windows, with their true activity', () => {
    const { rows } = readDemoCsv(join(dirA, 'windows.csv'));
    const truth = readDemoCsv(join(dirA, 'truth.csv')).rows;
    const labelled = rows.filter((r) => r[7] !== '');
    expect(labelled.length / rows.length).toBeGreaterThan(0.03);
    expect(labelled.length / rows.length).toBeLessThan(0.05);
    rows.forEach((r, i) => {
      expect(truth[i][0]).toBe(r[0]);
      if (r[7] !== '') expect(r[7]).toBe(truth[i][1]);
    });
    expect(new Set(truth.map((t) => t[1]))).toEqual(new Set(ACTIVITIES));
  });

  it('leaves non-wear gaps (≥ 60 s without windows) in every volunteer', () => {
    const { rows } = readDemoCsv(join(dirA, 'windows.csv'));
    const maxGap = new Map<string, number>();
    for (let i = 1; i < rows.length; i++) {
      if (rows[i][1] !== rows[i - 1][1]) continue;
      const gap = Number(rows[i][3]) - Number(rows[i - 1][4]);
      expect(gap).toBeGreaterThanOrEqual(0);
      maxGap.set(rows[i][1], Math.max(maxGap.get(rows[i][1]) ?? 0, gap));
    }
    expect(maxGap.size).toBe(12);
    for (const [subject, gap] of maxGap) expect(gap, subject).toBeGreaterThanOrEqual(60);
  });

  it('marks exactly S04 and S09 as loose-watch in truth.csv', () => {
    const truth = readDemoCsv(join(dirA, 'truth.csv')).rows;
    const loose = new Set(truth.filter((t) => t[2] === '1').map((t) => t[0].slice(0, 3)));
    expect([...loose].sort()).toEqual(['S04', 'S09']);
  });

  it('featurizing the raw CSV of S04 (as --raw writes it) reproduces its rows of windows.csv', () => {
    let rec: SimulatedRecording | undefined;
    for (const r of simulateStudy(DEFAULT_SEED)) if ((rec = r).volunteer.id === 'S04') break;
    const rawPath = join(dirB, 'S04.csv');
    writeFileSync(rawPath, rawCsv(rec!));
    const raw = readDemoCsv(rawPath);
    expect(raw.header).toEqual(['time_s', 'acc_x', 'acc_y', 'acc_z', 'gyr_x', 'gyr_y', 'gyr_z']);
    const col = (j: number) => Float64Array.from(raw.rows, (r) => Number(r[j]));
    const time = col(0);
    const segments = contiguousSegments(time, 50, { fileName: 'S04.csv' });
    expect(segments.length).toBeGreaterThan(1);
    const channels = { accX: col(1), accY: col(2), accZ: col(3), gyrX: col(4), gyrY: col(5), gyrZ: col(6) };
    const { starts, features } = featurizeImuRecording({ channels, sampleRateHz: 50, segments });
    const windows = readDemoCsv(join(dirA, 'windows.csv')).rows.filter((r) => r[1] === 'S04');
    expect(features.n).toBe(windows.length);
    const bad: string[] = [];
    windows.forEach((r, w) => {
      if (Math.abs(time[starts[w]] - Number(r[3])) > 1e-6) bad.push(`${r[0]}: start ${time[starts[w]]}`);
      r.slice(META.length).forEach((text, j) => {
        const v = features.data[w * features.d + j];
        // Printed with 6 significant digits.
        if (!(Math.abs(v - Number(text)) <= Math.abs(v) * 1e-5 + 1e-12)) bad.push(`${r[0]} ${FEATURE_NAMES[j]}: ${v} vs ${text}`);
      });
    });
    expect(bad).toEqual([]);
  });
});

describe('demo-data/generate.ts command line', () => {
  it('parses --raw, --out and --seed', () => {
    expect(parseArgs(['--raw', '--out', 'x', '--seed', '5'])).toEqual({ raw: true, outDir: 'x', seed: 5 });
  });

  it('exits non-zero with a message on an unknown flag', () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', join(DEMO_DIR, 'generate.ts'), '--bogus'], { encoding: 'utf8' });
    expect(run.status).toBe(1);
    expect(run.stderr).toContain('invalid argument: "--bogus"');
  });
});
