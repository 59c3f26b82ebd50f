import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../src/cli/args';
import { hasStackTrace, runCli, tempDir } from './run-cli';

const CSV = ['window_id,subject,start,f1,f2,f3',
  'w1,A,0,1,10,5', 'w2,A,5,2,,6', 'w3,A,10,3,12,7', 'w4,B,0,10,30,1',
  'w5,B,5,11,31,', 'w6,B,10,12,33,3', 'w7,C,0,5,20,4', 'w8,C,5,6,21,4'].join('\n');

/** The notes the CLI prints before anything else: the fixture's two empty feature cells. */
const NOTES = 'gleaner: note: in.csv, column "f2": 1 of 8 cells read as missing: 1 empty\n'
  + 'gleaner: note: in.csv, column "f3": 1 of 8 cells read as missing: 1 empty\n';
/** stderr without those notes. */
const afterNotes = (stderr: string) => {
  expect(stderr.startsWith(NOTES)).toBe(true);
  return stderr.slice(NOTES.length);
};

function fixture(): { dir: string; input: string } {
  const dir = tempDir('recipe');
  const input = join(dir, 'in.csv');
  writeFileSync(input, `${CSV}\n`);
  return { dir, input };
}

interface Summary { recipe: { step: string; params: Record<string, unknown>; effect: Record<string, unknown> }[]; clusters: { size: number }[] }
const summaryOf = (out: string) => JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')) as Summary;

describe('parseArgs recipe flags', () => {
  it('accepts --scale, --impute and --subject and rejects unknown values and --recipe with --scale', () => {
    expect(parseArgs(['analyze', 'x.csv', '--out', 'o', '--scale', 'robust', '--impute', 'subject-median', '--subject', 'pid']))
      .toMatchObject({ scale: 'robust', impute: 'subject-median', subject: 'pid' });
    expect(() => parseArgs(['analyze', 'x.csv', '--out', 'o', '--scale', 'log'])).toThrow(/invalid --scale: "log" \(expected one of zscore, robust, subject-zscore, minmax, none\)/);
    expect(() => parseArgs(['analyze', 'x.csv', '--out', 'o', '--recipe', 'r.json', '--impute', 'mean'])).toThrow(/--recipe and --impute cannot be combined/);
  });
});

describe('gleaner analyze with a recipe', () => {
  it('--scale robust --impute subject-median writes those steps into summary.json', () => {
    const { dir, input } = fixture();
    const out = join(dir, 'out');
    const r = runCli(['analyze', input, '--k', '2', '--scale', 'robust', '--impute', 'subject-median', '--progress', 'none', '--out', out]);
    expect(r.stderr).toBe(`${NOTES}gleaner: note: in.csv, feature "f2": 1 missing cell filled with the subject's median by recipe step 2 (impute)\n`
      + 'gleaner: note: in.csv, feature "f3": 1 missing cell filled with the subject\'s median by recipe step 2 (impute)\n');
    expect(r.status).toBe(0);
    const s = summaryOf(out);
    expect(s.recipe.map((x) => x.step)).toEqual(['robust', 'impute']);
    expect(s.recipe[1]).toMatchObject({ params: { method: 'median', scope: 'subject' }, effect: { filled: 2, filledFromAllSubjects: 0 } });
  });

  it('--impute drop leaves out windows with a missing value; windows.csv lists the analysed ones', () => {
    const { dir, input } = fixture();
    const out = join(dir, 'out');
    const r = runCli(['analyze', input, '--k', '2', '--impute', 'drop', '--progress', 'none', '--out', out]);
    expect(r.status).toBe(0);
    const rows = readFileSync(join(out, 'windows.csv'), 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(',')[0]);
    expect(rows).toEqual(['w1', 'w3', 'w4', 'w6', 'w7', 'w8']);
    const s = summaryOf(out);
    expect(s.recipe[0]).toMatchObject({ step: 'drop-missing', effect: { dropped: 2, kept: 6 } });
    expect(s.clusters.reduce((a, c) => a + c.size, 0)).toBe(6);
  });

  it('--recipe file runs its steps; a bad step fails in one line naming the step and field (exit 2)', () => {
    const { dir, input } = fixture();
    const good = join(dir, 'good.json');
    writeFileSync(good, JSON.stringify({ version: 1, steps: [{ type: 'log', mode: 'signed-log' }, { type: 'minmax' }, { type: 'impute', method: 'mean' }] }));
    const out = join(dir, 'out');
    expect(runCli(['analyze', input, '--k', '2', '--recipe', good, '--progress', 'none', '--out', out]).status).toBe(0);
    expect(summaryOf(out).recipe.map((x) => x.step)).toEqual(['log', 'minmax', 'impute']);

    const bad = join(dir, 'bad.json');
    writeFileSync(bad, JSON.stringify({ version: 1, steps: [{ type: 'zscore' }, { type: 'clip', lower: 120 }] }));
    const r = runCli(['analyze', input, '--k', '2', '--recipe', bad, '--out', join(dir, 'o2')]);
    expect(r.status).toBe(2);
    const err = afterNotes(r.stderr);
    expect(err).toMatch(/^gleaner: bad\.json: invalid recipe step 2 \(clip\) lower: 120/);
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(hasStackTrace(r.stderr)).toBe(false);
  });

  it('--subject names the subject column; an unknown one fails naming the file and column (exit 1)', () => {
    const { dir, input } = fixture();
    const r = runCli(['analyze', input, '--k', '2', '--subject', 'who', '--out', join(dir, 'o')]);
    expect(r.status).toBe(1);
    expect(afterNotes(r.stderr)).toMatch(/^gleaner: in\.csv, column "who": expected a column of this name for --subject/);
    const out = join(dir, 'o3');
    expect(runCli(['analyze', input, '--k', '2', '--subject', 'subject', '--scale', 'subject-zscore', '--progress', 'none', '--out', out]).status).toBe(0);
    expect(summaryOf(out).recipe[0]).toMatchObject({ step: 'subject-zscore', effect: { groups: 3 } });
  });
});
