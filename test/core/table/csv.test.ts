import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { parseCsv } from '../../../src/core/table/csv';

const bytes = (s: string) => new TextEncoder().encode(s);

function failure(input: string | Uint8Array, file = 'w.csv'): InputError {
  try {
    parseCsv(typeof input === 'string' ? bytes(input) : input, file);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('parseCsv(bytes, fileName)', () => {
  it('types numeric and categorical columns, with missing tokens', () => {
    const t = parseCsv(bytes('id,subject,acc_mean,label\n1,P01,0.5,walk\n2,P01,NA,\n3,P02,-1e-3,NaN\n4,P02,null,sit\n'), 'w.csv');
    expect(t.fileName).toBe('w.csv');
    expect(t.nRows).toBe(4);
    const [id, subject, acc, label] = t.columns;
    expect(id.kind).toBe('numeric');
    expect(subject).toEqual({ kind: 'categorical', name: 'subject', codes: Int32Array.from([0, 0, 1, 1]), dictionary: ['P01', 'P02'] });
    expect(acc.kind === 'numeric' && Array.from(acc.values)).toEqual([0.5, NaN, -0.001, NaN]);
    expect(label.kind === 'categorical' && Array.from(label.codes)).toEqual([0, -1, -1, 1]);
  });

  it('strips a BOM, handles CRLF, RFC 4180 quotes and blank lines', () => {
    // RFC 4180 section 2: quoted fields may hold commas, line breaks and doubled quotes.
    const t = parseCsv(bytes('\ufeffa,"b ""x"""\r\n1,"p,q"\r\n\r\n2,"line\r\nbreak"\r\n3,"say ""hi"""\r\n'), 'w.csv');
    expect(t.columns.map((c) => c.name)).toEqual(['a', 'b "x"']);
    const b = t.columns[1];
    expect(b.kind === 'categorical' && b.dictionary).toEqual(['p,q', 'line\r\nbreak', 'say "hi"']);
    expect(t.nRows).toBe(3);
  });

  it('rejects an empty or whitespace-only file', () => {
    expect(failure('').message).toMatch(/^w\.csv: .*empty file/);
    expect(failure(' \n\t\n').message).toMatch(/empty file/);
  });

  it('rejects a header without data rows', () => {
    const e = failure('a,b\n');
    expect(e.message).toContain('w.csv');
    expect(e.message).toMatch(/data row/);
  });

  it('names row, expected and found field counts for a ragged row', () => {
    const e = failure('a,b,c\n1,2,3\n4,5\n');
    expect(e.details).toMatchObject({ file: 'w.csv', row: 3, expected: '3 fields, as in the header', found: '2 fields (the delimiter is comma)' });
    expect(e.message).toContain('row 3');
  });

  it('reports an unterminated quote where it starts', () => {
    const e = failure('a,b\n1,2\n3,"open\n4,5\n');
    expect(e.details).toMatchObject({ file: 'w.csv', row: 3, column: 'b' });
    expect(e.message).toMatch(/closing quote/);
  });

  it('names both positions of a duplicate column name', () => {
    const e = failure('x,y,x\n1,2,3\n');
    expect(e.details).toMatchObject({ file: 'w.csv', row: 1, column: 'x' });
    expect(e.message).toContain('columns 1 and 3');
  });

  it('names file, row, column, "a number" and the text found in a numeric column', () => {
    const e = failure('t,acc\n0,1.5\n1,2.5\n2,oops\n3,4\n', 'sub01.csv');
    expect(e.details).toMatchObject({ file: 'sub01.csv', row: 4, column: 'acc', found: 'oops' });
    expect(e.message).toContain('sub01.csv, row 4, column "acc": expected a number');
  });

  it('rejects Inf and -Inf in a numeric column', () => {
    expect(failure('a\n1\nInf\n').details).toMatchObject({ row: 3, column: 'a', found: 'Inf' });
    expect(failure('a\n1\n2\n-inf\n').details).toMatchObject({ row: 4, column: 'a', found: '-inf' });
  });

  it('rejects bytes that are not UTF-8, naming the line', () => {
    const e = failure(Uint8Array.from([0x61, 0x0a, 0x62, 0xff, 0x0a]));
    expect(e.details).toMatchObject({ file: 'w.csv', row: 2 });
    expect(e.message).toMatch(/UTF-8/);
  });

  it('reads 100k rows × 50 columns into typed columns', () => {
    const header = Array.from({ length: 50 }, (_, j) => `f${j}`).join(',');
    const row = (i: number) => Array.from({ length: 50 }, (_, j) => ((i * 31 + j * 7) % 1000) / 100).join(',');
    const lines = [header];
    for (let i = 0; i < 100_000; i++) lines.push(row(i));
    const t = parseCsv(bytes(lines.join('\n')), 'big.csv');
    expect(t.nRows).toBe(100_000);
    expect(t.columns).toHaveLength(50);
    const c = t.columns[49];
    expect(c.kind === 'numeric' && c.values[99_999]).toBe(((99_999 * 31 + 49 * 7) % 1000) / 100);
  });
});
