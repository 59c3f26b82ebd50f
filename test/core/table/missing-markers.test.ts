import { describe, expect, it } from 'vitest';
import { InputError, OptionError } from '../../../src/core/errors';
import { seededRandom } from '../../../src/core/random';
import { parseCsv } from '../../../src/core/table/csv';
import { DEFAULT_MISSING_MARKERS, MissingMarkers } from '../../../src/core/table/missing-markers';
import { missingNotices } from '../../../src/core/table/notices';
import type { NumericColumn, Table } from '../../../src/core/table/table';

const enc = (s: string) => new TextEncoder().encode(s);
const numeric = (t: Table, name: string) => t.columns.find((c) => c.name === name) as NumericColumn;

/**
 * pandas' default `na_values` for read_csv (pandas.read_csv docstring, "By default the following
 * values are interpreted as NaN"; from memory of pandas 2.x): matched exactly, case included.
 */
const PANDAS_DEFAULT_NA = [
  '', '#N/A', '#N/A N/A', '#NA', '-1.#IND', '-1.#QNAN', '-NaN', '-nan', '1.#IND', '1.#QNAN',
  '<NA>', 'N/A', 'NA', 'NULL', 'NaN', 'None', 'n/a', 'nan', 'null',
];

describe('missing-value markers', () => {
  it('are, by default, pandas\' usual spellings plus the "?" and "-" that feature files of this field use', () => {
    const ours = new Set(DEFAULT_MISSING_MARKERS);
    const beyondPandas = [...ours].filter((m) => !PANDAS_DEFAULT_NA.includes(m));
    expect(beyondPandas.sort()).toEqual(['-', '?']);
    for (const m of ['', 'NA', 'N/A', 'NaN', 'nan', 'null', 'NULL']) expect(ours.has(m)).toBe(true);
  });

  it('read as missing in a numeric column, counted by marker, with the numbers around them intact', () => {
    // A generated table reproducing the quirk: "?" for a missing feature value, as in the public
    // activity-recognition sets that ship it, beside every other default marker.
    const random = seededRandom(15);
    const markers = DEFAULT_MISSING_MARKERS;
    const lines = ['id,f,g'];
    const expected: number[] = [];
    const counts: Record<string, number> = {};
    for (let i = 0; i < 200; i++) {
      const x = Math.round((random() * 20 - 10) * 1000) / 1000;
      if (i % 5 === 0) {
        const m = markers[(i / 5) % markers.length];
        counts[m] = (counts[m] ?? 0) + 1;
        lines.push(`${i},${m},${x}`);
        expected.push(NaN);
      } else {
        lines.push(`${i},${x},${x}`);
        expected.push(x);
      }
    }
    const t = parseCsv(enc(`${lines.join('\n')}\n`), 'q.csv');
    const f = numeric(t, 'f');
    expect(f.kind).toBe('numeric');
    expect(Array.from(f.values)).toEqual(expected);
    expect(t.missing).toEqual([{ column: 'f', total: 40, byMarker: counts }]);
    const notices = missingNotices(t);
    expect(notices).toHaveLength(1);
    expect(notices[0]).toMatchObject({ kind: 'missing-cells', column: 'f', count: 40 });
    expect(notices[0].message).toMatch(/^q\.csv, column "f": 40 of 200 cells read as missing: /);
    expect(notices[0].message).toContain(`${counts['?']} "?"`);
    expect(notices[0].message).toContain(`${counts['']} empty`);
  });

  it('match exactly, as pandas\' list does: "Null" and "na" are not markers, and name file, row and column when met', () => {
    for (const cell of ['Null', 'na', 'NAN', '??']) {
      const text = `id,f\n1,2.5\n2,${cell}\n3,1\n`;
      let err: unknown;
      try { parseCsv(enc(text), 'case.csv'); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).details).toMatchObject({ file: 'case.csv', row: 3, column: 'f', found: cell });
    }
  });

  it('can be only the empty cell: then "?" is an error that names the place and what was expected', () => {
    const text = 'id,f\n1,2.5\n2,\n3,?\n4,1\n5,2\n';
    expect(() => parseCsv(enc(text), 'e.csv', { missing: [''] })).toThrow(
      'e.csv, row 4, column "f": expected a number (leave the cell empty for a missing value), found "?"',
    );
    const t = parseCsv(enc('id,f\n1,2.5\n2,\n3,4\n'), 'e.csv', { missing: [''] });
    expect(Array.from(numeric(t, 'f').values)).toEqual([2.5, NaN, 4]);
  });

  it('may be a number such as -999, which then is missing on every path, long files included', () => {
    const lines = ['id,f'];
    for (let i = 0; i < 3000; i++) lines.push(`${i},${i % 3 === 0 ? '-999' : i / 4}`);
    const t = parseCsv(enc(`${lines.join('\n')}\n`), 'm.csv', { missing: ['-999', 'NA'] });
    const v = numeric(t, 'f').values;
    for (let i = 0; i < 3000; i++) expect(v[i]).toEqual(i % 3 === 0 ? NaN : i / 4);
    expect(t.missing).toEqual([{ column: 'f', total: 1000, byMarker: { '-999': 1000 } }]);
    // Without it in the list, -999 is a number like any other.
    expect(numeric(parseCsv(enc('id,f\n1,-999\n2,3\n'), 'm.csv'), 'f').values[0]).toBe(-999);
  });

  it('are matched after the cell\'s spaces are trimmed, quoted or not; text columns read them as missing too', () => {
    const t = parseCsv(enc('id,f,activity\n1, ? ,walk\n2,"NA",?\n3,1.5,run\n'), 's.csv');
    expect(Array.from(numeric(t, 'f').values)).toEqual([NaN, NaN, 1.5]);
    const a = t.columns[2];
    expect(a.kind === 'categorical' && Array.from(a.codes)).toEqual([0, -1, 1]);
  });

  it('refuse a marker with a line break or a double quote, which no cell can equal', () => {
    expect(() => new MissingMarkers(['a\nb'])).toThrow(OptionError);
    expect(() => new MissingMarkers(['"x"'])).toThrow(OptionError);
  });

  it('are counted for a table with no marker breakdown (a columnar file) from its missing values', () => {
    const t: Table = {
      fileName: 'p.parquet', nRows: 4,
      columns: [
        { kind: 'numeric', name: 'f', values: Float64Array.from([1, NaN, NaN, 2]) },
        { kind: 'categorical', name: 's', codes: Int32Array.from([0, -1, 0, 0]), dictionary: ['a'] },
        { kind: 'numeric', name: 'g', values: Float64Array.from([1, 2, 3, 4]) },
      ],
    };
    expect(missingNotices(t).map((n) => n.message)).toEqual([
      'p.parquet, column "f": 2 of 4 cells read as missing',
      'p.parquet, column "s": 1 of 4 cells read as missing',
    ]);
    // A partial label column is mostly empty by design, and an ignored column is not used: neither is told.
    const roles = [{ name: 'f', role: 'feature' as const, evidence: '' }, { name: 's', role: 'label' as const, evidence: '' }, { name: 'g', role: 'feature' as const, evidence: '' }];
    expect(missingNotices(t, roles).map((n) => n.column)).toEqual(['f']);
    expect(missingNotices(t, [roles[0], roles[1], roles[2]].map((r) => (r.name === 'f' ? { ...r, role: 'ignore' as const } : r))).map((n) => n.column)).toEqual([]);
  });
});
