import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { parseCsv } from '../../../src/core/table/csv';
import { createTableReader } from '../../../src/core/table/reader';
import type { Column, Table } from '../../../src/core/table/table';

const enc = (s: string) => new TextEncoder().encode(s);
const values = (c: Column) => (c.kind === 'numeric' ? Array.from(c.values) : c.codes.map((k) => k).reduce<string[]>((a, k) => [...a, k < 0 ? '' : c.dictionary[k]], []));
const plain = (t: Table) => t.columns.map((c) => [c.name, c.kind, values(c)]);

/** Pushes the bytes in chunks of the given sizes; delimiter and decimal given, so parsing starts at the first chunk. */
async function chunked(bytes: Uint8Array, fileName: string, sizes: number[], delimiter: ',' | ';' = ','): Promise<Table> {
  const reader = createTableReader('csv', fileName, { delimiter, decimal: '.' });
  let at = 0;
  for (let i = 0; at < bytes.length; i++) {
    const n = sizes[i % sizes.length];
    reader.push(bytes.subarray(at, at + n));
    at += n;
  }
  return reader.finish();
}

describe('CSV reader: delimiters, decimal comma and chunks', () => {
  it('detects a semicolon delimiter with a decimal comma (as written by a German-locale spreadsheet)', () => {
    const t = parseCsv(enc('window;subject;acc_mean;note\n1;P01;0,25;"a;b"\n2;P02;-1,5e2;x\n3;P01;;y\n'), 'de.csv');
    expect(plain(t)).toEqual([
      ['window', 'numeric', [1, 2, 3]],
      ['subject', 'categorical', ['P01', 'P02', 'P01']],
      ['acc_mean', 'numeric', [0.25, -150, NaN]],
      ['note', 'categorical', ['a;b', 'x', 'y']],
    ]);
  });

  it('detects a tab delimiter, and keeps a decimal point when the cells use one', () => {
    const t = parseCsv(enc('id\tsubject\tx\n1\tA\t0.5\n2\tB\t1,000\n'), 'w.txt');
    expect(t.columns.map((c) => c.name)).toEqual(['id', 'subject', 'x']);
    // "1,000" is neither a decimal-point number nor, with a decimal point file, a number at all.
    expect(t.columns[2].kind).toBe('categorical');
    const tsv = parseCsv(enc('a,b\tc\n1,5\t2\n'), 'w.tsv');
    expect(tsv.columns.map((c) => c.name)).toEqual(['a,b', 'c']);
  });

  it('gives the same table for every way of cutting the bytes into chunks (BOM, CRLF, quotes, blank lines)', async () => {
    const text = '\ufeffid,subject,"acc ""x""",start\r\n1,"P,01",0.5,2024-03-10T08:30:00Z\r\n\r\n2,"multi\r\nline",-1e-3,2024-03-10T08:30:05Z\r\n3,P02,,\r\n';
    const bytes = enc(text);
    const whole = parseCsv(bytes, 'w.csv');
    expect(plain(whole)[1]).toEqual(['subject', 'categorical', ['P,01', 'multi\r\nline', 'P02']]);
    expect(whole.lines && Array.from(whole.lines)).toEqual([2, 4, 6]);
    for (let size = 1; size <= bytes.length; size++) {
      const t = await chunked(bytes, 'w.csv', [size]);
      expect(plain(t)).toEqual(plain(whole));
      expect(Array.from(t.lines ?? [])).toEqual([2, 4, 6]);
    }
    expect(plain(await chunked(bytes, 'w.csv', [3, 1, 7, 2]))).toEqual(plain(whole));
    // Detection gathers the first 64 KiB before parsing: a long file still cuts across records.
    const long = enc(`id,subject,x\n${Array.from({ length: 20000 }, (_, i) => `${i},"S${i % 7}\r\nb",${i / 8}`).join('\r\n')}\r\n`);
    const viaAuto = createTableReader('csv', 'long.csv');
    for (let at = 0; at < long.length; at += 4093) viaAuto.push(long.subarray(at, at + 4093));
    expect(plain(await viaAuto.finish())).toEqual(plain(parseCsv(long, 'long.csv')));
  });

  it('reads a column of ISO 8601 times as seconds since 1970 (UTC) and prints them back', () => {
    const t = parseCsv(enc('start,x\n2024-03-10T08:30:00Z,1\n2024-03-10T10:30:05+02:00,2\n,3\n'), 'w.csv');
    const c = t.columns[0];
    expect(c.kind === 'numeric' && c.time).toBe('iso8601');
    // 2024-03-10T08:30:00Z = 1710059400 s (ECMAScript Date.UTC(2024, 2, 10, 8, 30) / 1000).
    expect(c.kind === 'numeric' && Array.from(c.values)).toEqual([Date.UTC(2024, 2, 10, 8, 30) / 1000, Date.UTC(2024, 2, 10, 8, 30, 5) / 1000, NaN]);
  });

  it('marks a numeric start column in epoch milliseconds', () => {
    const t = parseCsv(enc('t_start,x\n1710059400000,1\n1710059405000,2\n'), 'w.csv');
    expect(t.columns[0]).toMatchObject({ kind: 'numeric', time: 'milliseconds' });
  });

  it('stores feature columns in Float32 and time/id columns in Float64 under precision float32', () => {
    const t = parseCsv(enc('window_id,start,acc\n1,1710059400.25,0.1\n2,1710059405.5,0.2\n'), 'w.csv', { precision: 'float32' });
    const [id, start, acc] = t.columns;
    expect(id.kind === 'numeric' && id.values).toBeInstanceOf(Float64Array);
    expect(start.kind === 'numeric' && start.values[0]).toBe(1710059400.25);
    expect(acc.kind === 'numeric' && acc.values).toBeInstanceOf(Float32Array);
    expect(acc.kind === 'numeric' && acc.values[0]).toBe(Math.fround(0.1));
  });

  it('names the delimiter in a ragged-row error and reports an unterminated quote at its start across chunks', async () => {
    await expect(chunked(enc('a;b;c\n1;2;3\n4,5,6\n'), 'w.csv', [4], ';')).rejects.toMatchObject({ details: { row: 3, found: '1 field (the delimiter is semicolon)' } });
    const e = await chunked(enc('a,b\n1,2\n3,"open\n4,5\n'), 'w.csv', [2]).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).details).toMatchObject({ row: 3, column: 'b' });
  });
});

describe('CSV reader: numbers read in one pass with the record', () => {
  // The reader parses plain cells ([+-]digits[.digits], up to 15 digits) while it splits the
  // record; every value must equal Number(text) (ECMA-262 StringToNumber, correctly rounded),
  // stored in Float64 or rounded once to Float32 (Math.fround), whatever the cell's shape.
  const shapes = (random: () => number): string => {
    const digits = (n: number) => Array.from({ length: n }, () => String(Math.floor(random() * 10))).join('');
    const sign = ['', '-', '+'][Math.floor(random() * 3)];
    const kind = Math.floor(random() * 6);
    if (kind === 0) return `${sign}${digits(1 + Math.floor(random() * 18))}`;
    if (kind === 1) {
      const int = Math.floor(random() * 10);
      return `${sign}${digits(int)}.${digits(Math.max(int === 0 ? 1 : 0, Math.floor(random() * 12)))}`;
    }
    if (kind === 2) return `${sign}${digits(1 + Math.floor(random() * 4))}.${digits(1 + Math.floor(random() * 4))}e${Math.floor(random() * 40) - 20}`;
    if (kind === 3) return `${sign}0.${digits(14)}${digits(Math.floor(random() * 4))}`;
    if (kind === 4) return ['', 'NA', ' 1.5', '2.5 ', '\t-3', '+0.0', '5.', '.5', '-0', '007', '-.5', '1.e2'][Math.floor(random() * 12)];
    return `${digits(9)}${digits(Math.floor(random() * 8))}.${digits(Math.floor(random() * 3))}`;
  };

  it('equals Number(text) cell by cell, in Float64 and in Float32', async () => {
    const { seededRandom } = await import('../../../src/core/random');
    const random = seededRandom(99);
    const rows = Array.from({ length: 3000 }, () => [shapes(random), shapes(random), shapes(random)]);
    const text = `a,b,c\n${rows.map((r) => r.join(',')).join('\n')}\n`;
    for (const precision of ['float64', 'float32'] as const) {
      const t = parseCsv(enc(text), 'n.csv', { precision, delimiter: ',', decimal: '.' });
      t.columns.forEach((c, j) => {
        if (c.kind !== 'numeric') throw new Error(`${c.name} is ${c.kind}`);
        rows.forEach((r, i) => {
          const cell = r[j].trim();
          const want = cell === '' || cell === 'NA' ? NaN : Number(cell);
          const round = precision === 'float32' ? Math.fround(want) : want;
          expect(Object.is(c.values[i], round) ? 'ok' : `row ${i + 2} "${r[j]}": ${c.values[i]} vs ${round}`).toBe('ok');
        });
      });
    }
  });

  it('stores Math.fround(Number(text)) for long mantissas in Float32: shortest doubles, 18-digit scientific, and Float32 rounding midpoints', async () => {
    const { seededRandom, normal } = await import('../../../src/core/random');
    const random = seededRandom(123);
    const cells: string[] = [];
    const f32 = new Float32Array(2);
    const u32 = new Uint32Array(f32.buffer);
    for (let i = 0; i < 4000; i++) {
      const v = normal(random) * 10 ** Math.floor(random() * 10 - 5);
      cells.push(String(v), v.toExponential(17), v.toPrecision(16));
      // The exact midpoint between two adjacent Float32 values (a double), printed in full: the
      // quick value lies within 3.5e-16 of it, so which way it rounds is not certain and the
      // reader must fall back to Number(text) (ties to even).
      f32[0] = v;
      u32[1] = u32[0] + 1;
      const mid = (f32[0] + f32[1]) / 2;
      cells.push(String(mid), mid.toExponential(19));
    }
    const text = `a,b\n${cells.map((c, i) => `${c},${i}`).join('\n')}\n`;
    const t = parseCsv(enc(text), 'long.csv', { precision: 'float32', delimiter: ',', decimal: '.' });
    const a = t.columns[0];
    if (a.kind !== 'numeric') throw new Error('a is not numeric');
    expect(a.values).toBeInstanceOf(Float32Array);
    cells.forEach((cell, i) => {
      const want = Math.fround(Number(cell));
      expect(Object.is(a.values[i], want) ? 'ok' : `row ${i + 2} "${cell}": ${a.values[i]} vs ${want}`).toBe('ok');
    });
    // Ties exist among the midpoints: rounding them from an inexact value would have been wrong.
    expect(cells.filter((c, i) => i % 5 === 3 && Math.fround(Number(c)) !== Math.fround(Number(c) * (1 + 2 ** -50))).length).toBeGreaterThan(1000);
  });

  it('reads a decimal comma in the same pass (semicolon-separated)', () => {
    const t = parseCsv(enc('a;b\n-0,25;3\n1,5e3;+7,125\n'), 'de.csv', { delimiter: ';', decimal: ',' });
    expect(plain(t)).toEqual([['a', 'numeric', [-0.25, 1500]], ['b', 'numeric', [3, 7.125]]]);
    // Told comma for both, the comma delimits: "1,5" is two cells, as the general path reads it.
    const both = parseCsv(enc('a,b\n1,5\n2,25\n'), 'c.csv', { delimiter: ',', decimal: ',' });
    expect(plain(both)).toEqual([['a', 'numeric', [1, 2]], ['b', 'numeric', [5, 25]]]);
    expect(() => parseCsv(enc('a,b\n1,5,3\n'), 'c.csv', { delimiter: ',', decimal: ',' })).toThrow('c.csv, row 2: expected 2 fields, as in the header, found "3 fields (the delimiter is comma)"');
  });
});
