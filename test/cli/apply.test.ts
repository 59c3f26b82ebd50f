/**
 * `gleaner apply`: a study made by `gleaner analyze` on the demo windows labels (1) four subject
 * partitions in four formats (CSV, TSV, Parquet written by DuckDB, Arrow IPC written by
 * apache-arrow) exactly as it labels the whole file, row for row; (2) the study's own windows with
 * the clusters analyze gave them for at least 99.5% of windows; (3) with the curation of a saved
 * study (names, classes, a set-aside cluster, a merge); (4) as array tasks of
 * examples/slurm-apply.sh. Bad partitions get one line each.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tableFromArrays, tableToIPC } from 'apache-arrow';
import { beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../src/core/cautions';
import { duckdb, sqlPath } from '../fixtures/duckdb';
import { GOLDEN_ROOT } from '../golden/store';
import { ROOT, tempDir } from './run-cli';

const DEMO = join(ROOT, 'demo-data/windows.csv');
const LINES = readFileSync(DEMO, 'utf8').trimEnd().split('\n');
const HEADER = LINES[0];
const SUBJECT = HEADER.split(',').indexOf('subject');

function cli(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'src/cli/main.ts', ...args], {
    cwd: ROOT, encoding: 'utf8', timeout: 240_000, env: { ...process.env, SOURCE_DATE_EPOCH: '0', ...env },
  });
  if (r.error) throw r.error;
  return r;
}

const sha256 = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');
const body = (path: string) => readFileSync(path, 'utf8').trimEnd().split('\n').slice(1);
/** The demo's data lines of these subjects, in file order. */
const linesOf = (subjects: string[]) => LINES.slice(1).filter((l) => subjects.includes(l.split(',')[SUBJECT]));

/** A column of a CSV file without quoted fields (apply and analyze write none here). */
function column(path: string, name: string): string[] {
  const [header, ...lines] = readFileSync(path, 'utf8').trimEnd().split('\n');
  const j = header.split(',').indexOf(name);
  expect(j, `${name} in ${header}`).toBeGreaterThanOrEqual(0);
  return lines.map((l) => l.split(',')[j]);
}

/** An Arrow IPC file of CSV lines: numeric columns as Float64, the others as text (null when empty). */
function arrowFile(lines: string[]): Uint8Array {
  const names = HEADER.split(',');
  const cells = lines.map((l) => l.split(','));
  const columns: Record<string, Float64Array | (string | null)[]> = {};
  names.forEach((name, j) => {
    const texts = cells.map((c) => c[j]);
    const numeric = texts.every((t) => t !== '' && Number.isFinite(Number(t)));
    columns[name] = numeric ? Float64Array.from(texts, Number) : texts.map((t) => (t === '' ? null : t));
  });
  return tableToIPC(tableFromArrays(columns), 'file');
}

const STUDIES = {
  kmeans: ['--k', '6', '--seed', '4'],
  ward: ['--cluster', 'ward', '--k', '6'],
  'per-subject recipe': ['--scale', 'subject-zscore', '--impute', 'subject-median', '--k', '5'],
} as const;
type StudyName = keyof typeof STUDIES;

describe('gleaner apply', { timeout: 600_000 }, () => {
  const dir = tempDir('apply');
  const parts = ['p1.csv', 'p2.tsv', 'p3.parquet', 'p4.arrow'].map((p) => join(dir, p));
  const groups = [['S01', 'S02', 'S03'], ['S04', 'S05', 'S06'], ['S07', 'S08', 'S09'], ['S10', 'S11', 'S12']];
  const study = (name: StudyName) => join(dir, name.replace(/ /g, '-'), 'study.gleaner');

  beforeAll(async () => {
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    for (const name of Object.keys(STUDIES) as StudyName[]) {
      const a = cli(['analyze', join(dir, 'windows.csv'), '--out', join(study(name), '..'), '--progress', 'none', ...STUDIES[name]]);
      expect(a.status, a.stderr).toBe(0);
    }
    writeFileSync(parts[0], [HEADER, ...linesOf(groups[0])].join('\n') + '\n');
    writeFileSync(parts[1], [HEADER, ...linesOf(groups[1])].map((l) => l.replace(/,/g, '\t')).join('\n') + '\n');
    writeFileSync(join(dir, 'p3-source.csv'), [HEADER, ...linesOf(groups[2])].join('\n') + '\n');
    await duckdb(`COPY (SELECT * FROM read_csv(${sqlPath(join(dir, 'p3-source.csv'))}, header = true)) TO ${sqlPath(parts[2])} (FORMAT parquet)`);
    writeFileSync(parts[3], arrowFile(linesOf(groups[3])));
  }, 600_000);

  for (const name of Object.keys(STUDIES) as StudyName[]) {
    it(`${name}: four subject partitions give the whole file's labels, row for row; the manifest names every hash`, () => {
      const whole = cli(['apply', study(name), join(dir, 'windows.csv'), '--out', join(dir, `whole-${name}`), '--progress', 'none']);
      expect(whole.status, whole.stderr).toBe(0);
      const split = cli(['apply', study(name), ...parts, '--out', join(dir, `parts-${name}`), '--progress', 'none']);
      expect(split.status, split.stderr).toBe(0);
      expect(split.stdout).toContain(`labelled ${LINES.length - 1} windows of 4 inputs`);
      const outputs = ['p1', 'p2', 'p3', 'p4'].map((p) => join(dir, `parts-${name}`, `${p}.labels.csv`));
      const joined = outputs.flatMap(body);
      const all = body(join(dir, `whole-${name}`, 'windows.labels.csv'));
      expect(joined.length).toBe(LINES.length - 1);
      expect(joined).toEqual(all);

      const manifest = JSON.parse(readFileSync(join(dir, `parts-${name}`, 'manifest.json'), 'utf8'));
      expect(manifest.study.sha256).toBe(sha256(study(name)));
      expect(manifest.study.input.sha256).toBe(sha256(DEMO));
      expect(manifest.cautions).toEqual(CAUTIONS);
      expect(manifest.inputs.map((r: { file: string }) => r.file)).toEqual(['p1.csv', 'p2.tsv', 'p3.parquet', 'p4.arrow']);
      manifest.inputs.forEach((r: { sha256: string; rows: number; labelled: number; output: string; outputSha256: string }, t: number) => {
        expect(r.sha256).toBe(sha256(parts[t]));
        expect(r.rows).toBe(linesOf(groups[t]).length);
        expect(r.labelled).toBe(r.rows);
        expect(r.outputSha256).toBe(sha256(outputs[t]));
      });
    }, 300_000);
  }

  it('part files of a dataset partitioned by subject (DuckDB PARTITION_BY, no subject column inside) keep their subject from the folder', async () => {
    const cohort = join(dir, 'cohort');
    await duckdb(`COPY (SELECT * FROM read_csv(${sqlPath(DEMO)}, header = true)) TO ${sqlPath(cohort)} (FORMAT parquet, PARTITION_BY (subject))`);
    const all = cli(['apply', study('per-subject recipe'), join(dir, 'windows.csv'), '--out', join(dir, 'cohort-whole'), '--progress', 'none']);
    expect(all.status, all.stderr).toBe(0);
    const whole = body(join(dir, 'cohort-whole', 'windows.labels.csv'));
    const labelled: string[] = [];
    for (const s of ['S01', 'S02', 'S03', 'S04', 'S05', 'S06', 'S07', 'S08', 'S09', 'S10', 'S11', 'S12']) {
      const out = join(dir, 'cohort-labels', s);
      const r = cli(['apply', study('per-subject recipe'), join(cohort, `subject=${s}`, 'data_0.parquet'), '--out', out, '--progress', 'none']);
      expect(r.status, r.stderr).toBe(0);
      const lines = body(join(out, 'data_0.labels.csv'));
      expect(new Set(lines.map((l) => l.split(',')[1]))).toEqual(new Set([s]));
      labelled.push(...lines);
    }
    // DuckDB writes each partition's rows in an order of its own: compare the labelled windows as sets.
    expect(labelled.sort()).toEqual([...whole].sort());
  }, 300_000);

  it('examples/slurm-apply.sh: array tasks 0-3 (SLURM_ARRAY_TASK_ID set as sbatch sets it) give the whole file\'s labels', () => {
    writeFileSync(join(dir, 'parts.txt'), parts.join('\n') + '\n');
    const outputs: string[] = [];
    for (let task = 0; task < parts.length; task++) {
      const r = spawnSync('bash', ['examples/slurm-apply.sh', study('kmeans'), join(dir, 'parts.txt'), join(dir, 'slurm')], {
        cwd: ROOT, encoding: 'utf8', timeout: 120_000,
        env: { ...process.env, SLURM_ARRAY_TASK_ID: String(task), GLEANER: `${process.execPath} --import tsx src/cli/main.ts` },
      });
      expect(r.status, r.stderr).toBe(0);
      const folder = join(dir, 'slurm', 'parts', String(task).padStart(6, '0'));
      outputs.push(join(folder, `p${task + 1}.labels.csv`));
      expect(JSON.parse(readFileSync(join(folder, 'manifest.json'), 'utf8')).inputs[0].sha256).toBe(sha256(parts[task]));
    }
    const whole = cli(['apply', study('kmeans'), join(dir, 'windows.csv'), '--out', join(dir, 'slurm-whole'), '--progress', 'none']);
    expect(whole.status, whole.stderr).toBe(0);
    expect(outputs.flatMap(body)).toEqual(body(join(dir, 'slurm-whole', 'windows.labels.csv')));
    const beyond = spawnSync('bash', ['examples/slurm-apply.sh', study('kmeans'), join(dir, 'parts.txt'), join(dir, 'slurm')], {
      cwd: ROOT, encoding: 'utf8', env: { ...process.env, SLURM_ARRAY_TASK_ID: '4' },
    });
    expect(beyond.status).toBe(1);
    expect(beyond.stderr).toBe(`slurm-apply: ${join(dir, 'parts.txt')} has no line 5 for array task 4\n`);
  }, 300_000);

  for (const name of Object.keys(STUDIES) as StudyName[]) {
    it(`${name}: on the study's own windows it reproduces analyze's clusters for at least 99.5% of windows`, () => {
      const labels = join(dir, `whole-${name}`, 'windows.labels.csv');
      const r = cli(['apply', study(name), join(dir, 'windows.csv'), '--out', join(dir, `whole-${name}`), '--progress', 'none']);
      expect(r.status, r.stderr).toBe(0);
      const analyzed = column(join(study(name), '..', 'windows.csv'), 'cluster'); // both number clusters index + 1
      const applied = column(labels, 'cluster');
      const same = analyzed.filter((c, i) => c === applied[i]).length;
      console.log(`apply reproduces analyze (${name}): ${same} of ${analyzed.length} windows (${((100 * same) / analyzed.length).toFixed(2)}%)`);
      expect(applied.length).toBe(analyzed.length);
      expect(same / analyzed.length).toBeGreaterThanOrEqual(0.995);
      // Confidence is the analysis's own rule on the same centroids (the study has no curation).
      const conf = column(join(study(name), '..', 'windows.csv'), 'confidence');
      const sameConfidence = column(labels, 'confidence').filter((c, i) => c === conf[i]).length;
      console.log(`apply's confidence equals analyze's (${name}): ${sameConfidence} of ${conf.length} windows`);
      expect(sameConfidence / conf.length).toBeGreaterThanOrEqual(0.995);
      // The same study and input give the same bytes again.
      const before = readFileSync(labels);
      const again = cli(['apply', study(name), join(dir, 'windows.csv'), '--out', join(dir, `again-${name}`), '--progress', 'none']);
      expect(again.status, again.stderr).toBe(0);
      expect(readFileSync(join(dir, `again-${name}`, 'windows.labels.csv')).equals(before)).toBe(true);
      expect(readFileSync(join(dir, `again-${name}`, 'manifest.json')).equals(readFileSync(join(dir, `whole-${name}`, 'manifest.json')))).toBe(true);
    }, 300_000);
  }

  it('carries the curation of a saved study: class and working names, a set-aside cluster, no merged-away cluster', () => {
    // test/golden/make-study.ts: promote 0 "walking", name 1 "maybe typing", split 2 (part 1 becomes
    // cluster 5), promote 5 "stairs", set aside 3, merge 4 into 1.
    const r = cli(['apply', join(GOLDEN_ROOT, 'demo-study.gleaner'), join(dir, 'windows.csv'), '--study-input', DEMO, '--out', join(dir, 'curated'), '--progress', 'none']);
    expect(r.status, r.stderr).toBe(0);
    const path = join(dir, 'curated', 'windows.labels.csv');
    const [names, classes, aside] = ['cluster_name', 'class_name', 'set_aside'].map((c) => column(path, c));
    const rows = column(path, 'cluster').map((c, i) => [c, names[i], classes[i], aside[i]].join('|'));
    expect([...new Set(rows)].sort()).toEqual([
      '1|walking|walking|0', '2|maybe typing||0', '3|candidate 3||0', '4|candidate 4||1', '6|stairs|stairs|0',
    ]);
  }, 120_000);

  it('refuses a partition whose feature columns differ from the study\'s, naming the file and the columns', () => {
    const names = HEADER.split(',');
    const drop = names.indexOf('acc_x_mean');
    const edit = (l: string) => [...l.split(',').filter((_, j) => j !== drop), '0.5'].join(',');
    writeFileSync(join(dir, 'odd.csv'), [edit(HEADER).replace(/0\.5$/, 'battery'), ...linesOf(['S01']).map(edit)].join('\n') + '\n');
    const r = cli(['apply', study('kmeans'), join(dir, 'odd.csv'), '--out', join(dir, 'odd'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: odd.csv: expected the feature columns of study.gleaner (40): missing acc_x_mean; not in the study battery\n');
  }, 120_000);

  it('refuses text in a feature column, naming file, row and column (the reader\'s own line)', () => {
    const lines = [HEADER, ...linesOf(['S01'])];
    const j = HEADER.split(',').indexOf('acc_x_mean');
    lines[2] = lines[2].split(',').map((v, c) => (c === j ? 'high' : v)).join(',');
    writeFileSync(join(dir, 'text.csv'), lines.join('\n') + '\n');
    const r = cli(['apply', study('kmeans'), join(dir, 'text.csv'), '--out', join(dir, 'text'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: text.csv, row 3, column "acc_x_mean": expected a number (leave the cell empty or write NA for a missing value), found "high"\n');
  }, 120_000);

  it('refuses a typed text feature column (Arrow), naming file, row and column', () => {
    const names = HEADER.split(',');
    const cells = linesOf(['S03']).map((l) => l.split(','));
    const columns: Record<string, Float64Array | string[]> = {};
    names.forEach((name, j) => {
      const texts = cells.map((c) => c[j]);
      columns[name] = j < 8 || name === 'acc_y_sd' ? texts.map((t, i) => (name === 'acc_y_sd' && i === 6 ? 'n/a' : t)) : Float64Array.from(texts, Number);
    });
    writeFileSync(join(dir, 'typed.arrow'), tableToIPC(tableFromArrays(columns), 'file'));
    const r = cli(['apply', study('kmeans'), join(dir, 'typed.arrow'), '--out', join(dir, 'typed'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: typed.arrow, row 8, column "acc_y_sd": expected a number (a feature of study.gleaner), found "n/a"\n');
    // Every cell reads as a number, but the column is typed as text.
    columns.acc_y_sd = cells.map((c) => c[names.indexOf('acc_y_sd')]);
    writeFileSync(join(dir, 'typed-all.arrow'), tableToIPC(tableFromArrays(columns), 'file'));
    const all = cli(['apply', study('kmeans'), join(dir, 'typed-all.arrow'), '--out', join(dir, 'typed'), '--progress', 'none']);
    expect(all.status).toBe(1);
    expect(all.stderr).toBe('gleaner: typed-all.arrow, column "acc_y_sd": expected a numeric column (a feature of study.gleaner), found "numbers stored as text"\n');
  }, 120_000);

  it('refuses a study whose own windows table is missing or changed (the recipe is frozen on it)', () => {
    // The study's saved input path is ../windows.csv: two folders down, nothing is there.
    const moved = join(dir, 'moved', 'deeper');
    mkdirSync(moved, { recursive: true });
    copyFileSync(study('kmeans'), join(moved, 'study.gleaner'));
    const missing = cli(['apply', join(moved, 'study.gleaner'), parts[0], '--out', join(dir, 'moved-out'), '--progress', 'none']);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toBe(`gleaner: study.gleaner: expected its input windows.csv at ${join(dir, 'moved', 'windows.csv')} (the recipe is frozen on it; name it with --study-input), found "no such file"\n`);
    writeFileSync(join(dir, 'changed.csv'), [HEADER, ...LINES.slice(1, -1)].join('\n') + '\n');
    const changed = cli(['apply', join(moved, 'study.gleaner'), parts[0], '--study-input', join(dir, 'changed.csv'), '--out', join(dir, 'moved-out'), '--progress', 'none']);
    expect(changed.status).toBe(1);
    expect(changed.stderr).toBe(`gleaner: changed.csv: expected the input saved in study.gleaner (SHA-256 ${sha256(DEMO)}; this file's is ${sha256(join(dir, 'changed.csv'))}), found "a changed file"\n`);
    expect(existsSync(join(dir, 'moved-out'))).toBe(false);
  }, 120_000);

  it('refuses a missing value when the study\'s recipe fills none, naming file, row and column', () => {
    writeFileSync(join(dir, 'zscore-only.json'), JSON.stringify({ version: 1, steps: [{ type: 'zscore' }] }));
    const a = cli(['analyze', join(dir, 'windows.csv'), '--out', join(dir, 'zscore-only'), '--recipe', join(dir, 'zscore-only.json'), '--k', '4', '--progress', 'none']);
    expect(a.status, a.stderr).toBe(0);
    const lines = [HEADER, ...linesOf(['S02'])];
    const j = HEADER.split(',').indexOf('gyr_x_sd');
    lines[4] = lines[4].split(',').map((v, c) => (c === j ? '' : v)).join(',');
    writeFileSync(join(dir, 'gap.csv'), lines.join('\n') + '\n');
    const r = cli(['apply', join(dir, 'zscore-only', 'study.gleaner'), join(dir, 'gap.csv'), '--out', join(dir, 'gap'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: gap.csv, row 5, column "gyr_x_sd": expected a value: the study\'s recipe does not fill missing values (add an impute step to it), found "a missing value"\n');
  }, 120_000);

  it('refuses a run clustered on the map, naming the study', () => {
    const a = cli(['analyze', join(dir, 'windows.csv'), '--out', join(dir, 'on-map'), '--space', 'map', '--k', '4', '--progress', 'none']);
    expect(a.status, a.stderr).toBe(0);
    const r = cli(['apply', join(dir, 'on-map', 'study.gleaner'), join(dir, 'windows.csv'), '--out', join(dir, 'on-map-labels'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: study.gleaner: expected a k-means or tree run clustered in the scaled feature space (apply assigns by nearest centroid there), found "run run-1: clustered on the map"\n');
  }, 120_000);

  it('refuses a per-subject recipe on a partition holding a single window of a subject', () => {
    writeFileSync(join(dir, 'split.csv'), [HEADER, linesOf(['S01'])[0], ...linesOf(['S02'])].join('\n') + '\n');
    const r = cli(['apply', study('per-subject recipe'), join(dir, 'split.csv'), '--out', join(dir, 'split'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: split.csv, column "subject": expected at least 2 windows of each subject for recipe step 1 (subject-zscore): keep each subject\'s windows whole in one partition, found "subject S01: 1 window"\n');
  }, 120_000);
});
