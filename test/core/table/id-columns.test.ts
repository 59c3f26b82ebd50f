import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { seededRandom } from '../../../src/core/random';
import { checkTable } from '../../../src/core/table/checks';
import { parseCsv } from '../../../src/core/table/csv';
import { featureMatrix } from '../../../src/core/table/matrix';
import { inferRoles, inferRolesTold } from '../../../src/core/table/roles';

const enc = (s: string) => new TextEncoder().encode(s);

/**
 * A generated table reproducing the quirk of a public featurized activity-recognition set: its
 * numeric UNIQUE_ID column is no window id at all but counts 1, 2, 3, ... within each run of
 * windows (one person doing one activity) and restarts with the next run. Run lengths are seeded.
 */
function runsTable(idName: string): { text: string; ids: number[]; runs: number } {
  const random = seededRandom(728);
  const lines = [`${idName},user,activity,f1,f2`];
  const ids: number[] = [];
  let runs = 0;
  for (let user = 1; user <= 12; user++) {
    for (const activity of ['walk', 'sit', 'stand']) {
      const length = 20 + Math.floor(random() * 60);
      runs++;
      for (let k = 1; k <= length; k++) {
        ids.push(k);
        lines.push([k, user, activity, (random() + (activity === 'walk' ? 3 : 0)).toFixed(4), random().toFixed(4)].join(','));
      }
    }
  }
  return { text: `${lines.join('\n')}\n`, ids, runs };
}

const grouped = (n: number) => n.toLocaleString('en-US');

describe('identifier columns', () => {
  it('a numeric id that restarts in runs is left out of the features, with a notice giving its distinct values and rows', () => {
    const { text, ids, runs } = runsTable('UNIQUE_ID');
    const t = parseCsv(enc(text), 'har.csv');
    const { roles, notices } = inferRolesTold(t);
    const id = roles.find((r) => r.name === 'UNIQUE_ID');
    expect(id?.role).toBe('ignore');
    expect(featureMatrix(t, roles).featureNames).toEqual(['f1', 'f2']);
    const distinct = new Set(ids).size;
    expect(notices).toEqual([{
      kind: 'id-like', column: 'UNIQUE_ID', count: distinct,
      message: `har.csv, column "UNIQUE_ID" looks like an identifier (name "UNIQUE_ID", integers counting up by 1 in runs (${runs - 1} restarts)) ` +
        `but holds ${distinct} distinct values in ${grouped(ids.length)} rows; not used as a feature`,
    }]);
    // Fewer than half its values distinct: not held to uniqueness, the table loads.
    expect(checkTable(t, roles)).toEqual([]);
  });

  it('recognises a per-run counter by its values alone, whatever its name', () => {
    const { text } = runsTable('k');
    const t = parseCsv(enc(text), 'har.csv');
    const { roles, notices } = inferRolesTold(t);
    expect(roles[0]).toMatchObject({ name: 'k', role: 'ignore' });
    expect(notices.map((n) => [n.kind, n.column])).toEqual([['id-like', 'k']]);
    expect(roles.find((r) => r.name === 'user')?.role).toBe('subject');
  });

  it('a unique sequence becomes the window id, told when only its values said so', () => {
    const lines = ['n,f'];
    for (let i = 0; i < 30; i++) lines.push(`${100 + i},${(i % 3) + 0.5}`);
    const { roles, notices } = inferRolesTold(parseCsv(enc(lines.join('\n')), 's.csv'));
    expect(roles[0]).toMatchObject({ name: 'n', role: 'id' });
    expect(notices).toEqual([{ kind: 'window-id', column: 'n', message: 's.csv, column "n": a sequence of integers counting up by 1, one per row: used as the window id' }]);
    // Named like an id, it is the id without a word.
    const named = inferRolesTold(parseCsv(enc(lines.join('\n').replace(/^n,/, 'row,')), 's.csv'));
    expect(named.roles[0]).toMatchObject({ name: 'row', role: 'id' });
    expect(named.notices).toEqual([]);
  });

  it('near-unique shuffled row numbers and names such as idx, index, uid, _id are identifiers', () => {
    const random = seededRandom(3);
    const n = 200;
    const order = Array.from({ length: n }, (_, i) => i + 1);
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [order[i], order[j]] = [order[j], order[i]];
    }
    order[7] = order[8]; // one repeat: near-unique, not unique
    const lines = ['shuffled,f'];
    for (let i = 0; i < n; i++) lines.push(`${order[i]},${random().toFixed(3)}`);
    const t = parseCsv(enc(lines.join('\n')), 'r.csv');
    const told = inferRolesTold(t);
    expect(told.roles[0].role).toBe('ignore');
    expect(told.notices[0].message).toBe(`r.csv, column "shuffled" looks like an identifier (near-unique integers filling 1..${n}) but holds ${n - 1} distinct values in ${n} rows; not used as a feature`);
    for (const name of ['idx', 'Index', 'uid', 'sample_id', 'UNIQUE_ID', 'rowid']) {
      const codes = parseCsv(enc(`${name},f\n${Array.from({ length: 12 }, (_, i) => `${i % 4},${i / 3}`).join('\n')}\n`), 'c.csv');
      expect(inferRoles(codes)[0]).toMatchObject({ name, role: 'ignore' });
    }
  });

  it('a second unique id-like column is left out and the notice names the window id', () => {
    const lines = ['window_id,row,f'];
    for (let i = 0; i < 20; i++) lines.push(`w${i},${i},${(i * 7) % 5}`);
    const { roles, notices } = inferRolesTold(parseCsv(enc(lines.join('\n')), 'two.csv'));
    expect(roles.map((r) => r.role)).toEqual(['id', 'ignore', 'feature']);
    expect(notices[0].message).toBe('two.csv, column "row" looks like an identifier (name "row", a sequence of integers counting up by 1) but is unique while "window_id" is the window id; not used as a feature');
  });

  it('leaves an integer feature whose name only begins with "window" alone', () => {
    const random = seededRandom(12);
    const lines = ['window_steps,f'];
    for (let i = 0; i < 50; i++) lines.push(`${Math.floor(random() * 30)},${random().toFixed(3)}`);
    const { roles, notices } = inferRolesTold(parseCsv(enc(lines.join('\n')), 'w.csv'));
    expect(roles.map((r) => r.role)).toEqual(['feature', 'feature']);
    expect(notices).toEqual([]);
  });

  it('leaves measurements, subject codes and labels alone: integer counts, floats, codes in runs', () => {
    const random = seededRandom(11);
    const lines = ['subject_id,activity,steps,energy'];
    for (let i = 0; i < 300; i++) lines.push([1 + Math.floor(i / 30), 1 + (Math.floor(i / 10) % 3), Math.floor(random() * 40), (random() * 9).toFixed(3)].join(','));
    const { roles, notices } = inferRolesTold(parseCsv(enc(lines.join('\n')), 'm.csv'));
    expect(roles.map((r) => r.role)).toEqual(['subject', 'label', 'feature', 'feature']);
    expect(notices).toEqual([]);
  });

  it('an id column that is mostly unique but repeats a value is still an error naming the rows', () => {
    const lines = ['window_id,f'];
    for (let i = 0; i < 20; i++) lines.push(`${i === 9 ? 3 : i},${i % 4}`);
    const t = parseCsv(enc(lines.join('\n')), 'dup.csv');
    const roles = inferRoles(t);
    expect(() => checkTable(t, roles)).toThrow(InputError);
    expect(() => checkTable(t, roles)).toThrow('dup.csv, row 11, column "window_id": expected a unique window id on every row, found "\\"3\\" again (first on row 5)"');
  });

  it('lets the user keep such a column as a feature: an override wins and nothing is told', () => {
    const { text } = runsTable('UNIQUE_ID');
    const t = parseCsv(enc(text), 'har.csv');
    const { roles, notices } = inferRolesTold(t, { UNIQUE_ID: 'feature' });
    expect(featureMatrix(t, roles).featureNames).toEqual(['UNIQUE_ID', 'f1', 'f2']);
    expect(notices).toEqual([]);
  });

  it('tells a column left out by its name, and a text column named like an id whose values mostly repeat', () => {
    const lines = ['window_id,notes,f'];
    for (let i = 0; i < 12; i++) lines.push(`w${i % 4},${i === 2 ? 'loose strap' : ''},${i / 7}`);
    const { roles, notices } = inferRolesTold(parseCsv(enc(lines.join('\n')), 'n.csv'));
    expect(roles.map((r) => r.role)).toEqual(['metadata', 'ignore', 'feature']);
    expect(notices.map((n) => n.message)).toEqual([
      'n.csv, column "window_id" is named like a window id but repeats its values (4 distinct in 12 rows); not used as the window id',
      'n.csv, column "notes": not used (its name says free text)',
    ]);
  });
});
