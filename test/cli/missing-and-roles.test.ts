import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../src/cli/args';
import { seededRandom } from '../../src/core/random';
import { hasStackTrace, runCli, tempDir } from './run-cli';

/**
 * A generated study of three well-separated groups whose feature cells are sometimes missing,
 * written once with empty cells and once with "?" (the marker a public activity-recognition
 * feature set ships): the two must load and cluster alike, and the CLI must say how many cells
 * of each column it read as missing.
 */
function study(marker: string): string {
  const random = seededRandom(1515);
  const lines = ['window_id,subject,f1,f2,f3'];
  for (let i = 0; i < 90; i++) {
    const g = i % 3;
    const f = [0, 1, 2].map((j) => (g * 4 + j + random() - 0.5).toFixed(4));
    if (i % 9 === 1) f[0] = marker;
    if (i % 15 === 4) f[2] = marker;
    lines.push([`w${i}`, `S${i % 6}`, ...f].join(','));
  }
  return `${lines.join('\n')}\n`;
}

const summaryOf = (dir: string) => JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8')) as Record<string, unknown> & {
  notices: { kind: string; column: string; count: number; message: string }[];
  input: { featureNames: string[] };
  roles: { column: string; role: string; evidence: string }[];
};

describe('gleaner analyze: missing-value markers and --role', () => {
  const dir = tempDir('markers');
  const empty = join(dir, 'empty.csv');
  const question = join(dir, 'question.csv');
  writeFileSync(empty, study(''));
  writeFileSync(question, study('?'));

  it('clusters a table with "?" markers exactly as the same table with empty cells, and says what it read as missing', () => {
    const a = runCli(['analyze', empty, '--k', '3', '--restarts', '2', '--progress', 'none', '--out', join(dir, 'a')]);
    const b = runCli(['analyze', question, '--k', '3', '--restarts', '2', '--progress', 'none', '--out', join(dir, 'b')]);
    expect(a.status).toBe(0);
    expect(b.status).toBe(0);
    expect(readFileSync(join(dir, 'b', 'windows.csv'), 'utf8')).toBe(readFileSync(join(dir, 'a', 'windows.csv'), 'utf8'));
    // f1 misses rows 1, 10, ... (i % 9 === 1: 10 of 90), f3 rows 4, 19, ... (i % 15 === 4: 6 of 90).
    // Then, after the run, the cells the default recipe filled in each feature.
    expect(b.stderr.trimEnd().split('\n')).toEqual([
      'gleaner: note: question.csv, column "f1": 10 of 90 cells read as missing: 10 "?"',
      'gleaner: note: question.csv, column "f3": 6 of 90 cells read as missing: 6 "?"',
      'gleaner: note: question.csv, feature "f1": 10 missing cells filled with the feature mean (0 after scaling) by recipe step 2 (impute)',
      'gleaner: note: question.csv, feature "f3": 6 missing cells filled with the feature mean (0 after scaling) by recipe step 2 (impute)',
    ]);
    expect(a.stderr).toContain('gleaner: note: empty.csv, column "f1": 10 of 90 cells read as missing: 10 empty');
    const s = summaryOf(join(dir, 'b'));
    expect(s.notices.map((n) => [n.kind, n.column, n.count])).toEqual([
      ['missing-cells', 'f1', 10], ['missing-cells', 'f3', 6], ['cells-filled', 'f1', 10], ['cells-filled', 'f3', 6],
    ]);
    // The same figure summary.json records for the impute step.
    expect((s.recipe as { effect: { filled?: number } }[])[1].effect.filled).toBe(16);
    expect(s.notices.map((n) => `gleaner: note: ${n.message}`)).toEqual(b.stderr.trimEnd().split('\n'));
  });

  it('with --na \'\' reads only empty cells as missing, so a "?" stops the run at its row and column', () => {
    const r = runCli(['analyze', question, '--k', '3', '--na', '', '--progress', 'none', '--out', join(dir, 'c')]);
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('gleaner: question.csv, row 3, column "f1": expected a number (leave the cell empty for a missing value), found "?"\n');
  });

  it('with --na reads the markers listed, and only those', () => {
    const text = study('?').replace(/^(w7,S1,)[^,]+/m, '$1missing');
    const input = join(dir, 'own.csv');
    writeFileSync(input, text);
    const r = runCli(['analyze', input, '--k', '3', '--na', '?,missing', '--progress', 'none', '--out', join(dir, 'd')]);
    expect(r.status).toBe(0);
    expect(r.stderr).toContain('column "f1": 11 of 90 cells read as missing: 10 "?", 1 "missing"');
    const refused = runCli(['analyze', input, '--k', '3', '--na', 'missing', '--progress', 'none', '--out', join(dir, 'e')]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/row 3, column "f1": expected a number .*found "\?"/);
  });

  it('--role sets a column\'s role as the roles menu does: an ignored column is no feature, and the summary says who set it', () => {
    const r = runCli(['analyze', empty, '--k', '3', '--role', 'f3=ignore', '--role', 'subject=metadata', '--progress', 'none', '--out', join(dir, 'f')]);
    expect(r.status).toBe(0);
    const s = summaryOf(join(dir, 'f'));
    expect(s.input.featureNames).toEqual(['f1', 'f2']);
    expect(s.roles.filter((x) => x.evidence === 'set by you').map((x) => [x.column, x.role])).toEqual([['subject', 'metadata'], ['f3', 'ignore']]);
  });

  it('--role with an unknown column or role is a usage error naming it (exit 2, one line)', () => {
    const cases: [string, RegExp][] = [
      ['f9=feature', /^gleaner: --role: no column "f9" in empty\.csv \(columns: window_id, subject, f1, f2, f3\)/],
      ['f1=colour', /^gleaner: --role "f1=colour": unknown role "colour" \(expected one of id, subject, session, start, end, duration, feature, label, metadata, ignore\)/],
      ['f1', /^gleaner: --role "f1": expected <column>=<role>/],
    ];
    for (const [arg, message] of cases) {
      const r = runCli(['analyze', empty, '--role', arg, '--progress', 'none', '--out', join(dir, 'g')]);
      expect(r.status).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(hasStackTrace(r.stderr)).toBe(false);
    }
  });
});

describe('parsing --na and --role', () => {
  it('keeps every --role in order and reads --na as a comma list, \'\' as only the empty cell', () => {
    const c = parseArgs(['analyze', 'x.csv', '--out', 'o', '--role', 'a=id', '--role=b c=label', '--na', '']);
    expect(c.command === 'analyze' && [c.roles, c.missing]).toEqual([{ a: 'id', 'b c': 'label' }, ['']]);
    const d = parseArgs(['analyze', 'x.csv', '--out', 'o', '--na', 'NA, ?,-999']);
    expect(d.command === 'analyze' && d.missing).toEqual(['NA', '?', '-999']);
  });

  it('still refuses other flags given twice, and --role giving one column two roles', () => {
    expect(() => parseArgs(['analyze', 'x.csv', '--out', 'o', '--k', '3', '--k', '4'])).toThrow('option --k given twice');
    expect(() => parseArgs(['analyze', 'x.csv', '--out', 'o', '--role', 'a=id', '--role', 'a=label'])).toThrow('--role: column "a" given two roles (id and label)');
  });
});

describe('gleaner analyze: identifier columns', () => {
  const dir = tempDir('ids');
  // Three groups of windows; UNIQUE_ID counts 1, 2, ... within each run of 15 and restarts, as a
  // public activity-recognition set's does. Clustering on it would mix the counter into the map.
  const lines = ['UNIQUE_ID,subject,f1,f2'];
  const bare = ['subject,f1,f2'];
  const random = seededRandom(99);
  for (let i = 0; i < 90; i++) {
    const g = Math.floor(i / 15) % 3;
    const f = [g * 5 + random(), g * 5 + random()].map((x) => x.toFixed(4));
    lines.push([(i % 15) + 1, `S${Math.floor(i / 30)}`, ...f].join(','));
    bare.push([`S${Math.floor(i / 30)}`, ...f].join(','));
  }
  const withId = join(dir, 'with-id.csv');
  const without = join(dir, 'without.csv');
  writeFileSync(withId, `${lines.join('\n')}\n`);
  writeFileSync(without, `${bare.join('\n')}\n`);
  const clusters = (out: string) => readFileSync(join(out, 'windows.csv'), 'utf8').trimEnd().split('\n').map((l) => l.split(',').slice(-2).join(','));

  it('leaves a non-unique numeric id out of the features, says so, and clusters as if it were not there', () => {
    const a = runCli(['analyze', withId, '--k', '3', '--progress', 'none', '--out', join(dir, 'a')]);
    const b = runCli(['analyze', without, '--k', '3', '--progress', 'none', '--out', join(dir, 'b')]);
    expect(a.status).toBe(0);
    expect(b.status).toBe(0);
    expect(a.stderr).toBe('gleaner: note: with-id.csv, column "UNIQUE_ID" looks like an identifier (name "UNIQUE_ID", integers counting up by 1 in runs (5 restarts)) but holds 15 distinct values in 90 rows; not used as a feature\n');
    const s = summaryOf(join(dir, 'a'));
    expect(s.input.featureNames).toEqual(['f1', 'f2']);
    expect(s.notices.map((n) => [n.kind, n.column, n.count])).toEqual([['id-like', 'UNIQUE_ID', 15]]);
    expect(clusters(join(dir, 'a'))).toEqual(clusters(join(dir, 'b')));
  });

  it('--role UNIQUE_ID=feature puts it back, and then nothing is told', () => {
    const r = runCli(['analyze', withId, '--k', '3', '--role', 'UNIQUE_ID=feature', '--progress', 'none', '--out', join(dir, 'c')]);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    expect(summaryOf(join(dir, 'c')).input.featureNames).toEqual(['UNIQUE_ID', 'f1', 'f2']);
  });
});

describe('gleaner: notices of a wide table, and inspect', () => {
  const dir = tempDir('wide');
  // 30 features, each missing in a few windows at seeded places: 60 notices in all (read, filled).
  const random = seededRandom(561);
  const names = Array.from({ length: 30 }, (_, j) => `tBodyAcc_${j}`);
  const lines = [['window_id', 'subject', ...names].join(',')];
  const missing = new Array<number>(30).fill(0);
  for (let i = 0; i < 60; i++) {
    const cells = names.map((_, j) => {
      if (random() < 0.08 || i === j) { missing[j]++; return '?'; }
      return ((i % 3) + random()).toFixed(3);
    });
    lines.push([`w${i}`, `S${i % 4}`, ...cells].join(','));
  }
  const input = join(dir, 'wide.csv');
  writeFileSync(input, `${lines.join('\n')}\n`);

  it('prints at most 12 lines of one kind and counts the rest; summary.json lists every one', () => {
    const r = runCli(['analyze', input, '--k', '3', '--progress', 'none', '--out', join(dir, 'o')]);
    expect(r.status).toBe(0);
    const err = r.stderr.trimEnd().split('\n');
    expect(err.filter((l) => l.includes('cells read as missing'))).toHaveLength(12);
    expect(err).toContain('gleaner: note: 18 more notices of this kind (missing-cells), all listed in summary.json notices');
    expect(err).toContain('gleaner: note: 18 more notices of this kind (cells-filled), all listed in summary.json notices');
    expect(err).toHaveLength(26);
    const s = summaryOf(join(dir, 'o'));
    expect(s.notices.filter((n) => n.kind === 'missing-cells').map((n) => n.count)).toEqual(missing);
    expect(s.notices.filter((n) => n.kind === 'cells-filled').map((n) => n.count)).toEqual(missing);
  });

  it('inspect lists the same notices about the input in its JSON', () => {
    const r = runCli(['inspect', input]);
    expect(r.status).toBe(0);
    const s = JSON.parse(r.stdout) as { notices: { kind: string; column: string; count: number }[] };
    expect(s.notices.map((n) => [n.kind, n.column, n.count])).toEqual(names.map((f, j) => ['missing-cells', f, missing[j]]));
  });
});

describe('gleaner sweep: --na and --role', () => {
  const dir = tempDir('sweep-na');
  const input = join(dir, 'question.csv');
  writeFileSync(input, study('?'));

  it('reads the markers, tells them, and takes --role as analyze does', () => {
    const r = runCli(['sweep', input, '--k-min', '2', '--k-max', '3', '--role', 'f3=ignore', '--json', '--progress', 'none']);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ windows: 90, features: 2 });
    expect(r.stderr.trimEnd().split('\n')).toEqual([
      'gleaner: note: question.csv, column "f1": 10 of 90 cells read as missing: 10 "?"',
      'gleaner: note: question.csv, feature "f1": 10 missing cells filled with the feature mean (0 after scaling) by recipe step 2 (impute)',
    ]);
    const refused = runCli(['sweep', input, '--na', '', '--progress', 'none']);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/^gleaner: question\.csv, row 3, column "f1": expected a number/);
    const unknown = runCli(['sweep', input, '--role', 'nope=id', '--progress', 'none']);
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/^gleaner: --role: no column "nope" in question\.csv/);
  });
});
