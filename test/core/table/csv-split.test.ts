import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { seededRandom, type Random } from '../../../src/core/random';
import { CsvReader, lineEndAfter } from '../../../src/core/table/csv-reader';
import type { ReadOptions } from '../../../src/core/table/reader.types';
import type { Table } from '../../../src/core/table/table';

// A file read by two readers (the start by one, the rest by a `continuing` reader, joined with
// `absorb`) must give exactly the table one reader gives on the same bytes: the reference here is
// the single-reader parse, itself checked against worked examples in csv-reader.test.ts.

const enc = (s: string) => new TextEncoder().encode(s);
// The dialect is given: detection waits for 64 KiB, more than these files hold.
const COMMA: ReadOptions = { delimiter: ',', decimal: '.' };

function readWhole(bytes: Uint8Array, options: ReadOptions): Table | string {
  try {
    const r = new CsvReader('w.csv', options);
    r.push(bytes);
    return r.finishSync();
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
}

/** Reads bytes [0, cut) with one reader and [cut, end) with another, in chunks of `chunk`. */
function readInTwo(bytes: Uint8Array, cut: number, options: ReadOptions, chunk: number): Table | string | 'not joined' {
  const first = new CsvReader('w.csv', options);
  try {
    for (let at = 0; at < cut; at += chunk) first.push(bytes.subarray(at, Math.min(cut, at + chunk)));
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
  const layout = first.layout();
  if (!layout || first.sawQuote || first.pendingBytes > 0) return 'not joined';
  let part;
  try {
    const rest = CsvReader.continuing('w.csv', layout);
    for (let at = cut; at < bytes.length; at += chunk) rest.push(bytes.subarray(at, Math.min(bytes.length, at + chunk)));
    // As posted between threads.
    part = structuredClone(rest.endPart());
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    // The second reader counts lines from its first byte: the host moves the row by the first part's lines.
    const row = e.details.row === undefined ? undefined : e.details.row + first.nextLine - 1;
    return new InputError({ ...e.details, row }).message;
  }
  if (!first.absorb(part)) return 'not joined';
  try {
    return first.finishSync();
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
}

const pick = <T>(random: Random, xs: T[]): T => xs[Math.floor(random() * xs.length)];

/** A seeded file with the cells a study table holds: ids, subjects, ISO times, numbers, blanks, missing-value markers. */
function studyText(random: Random, rows: number, crlf: boolean, extra: (i: number) => string): string {
  const eol = crlf ? '\r\n' : '\n';
  const lines = ['id,subject,start,f0,f1,note'];
  for (let i = 0; i < rows; i++) {
    const f0 = pick(random, ['', 'NA', '?', '-', 'N/A', (random() * 10 - 5).toFixed(3), `${Math.round(random() * 100)}e-2`]);
    const f1 = (random() * 1000).toFixed(6);
    const sec = String(i % 60).padStart(2, '0');
    lines.push([i, `S${i % 3}`, `2024-03-10T08:00:${sec}Z`, f0, f1, extra(i)].join(','));
    if (random() < 0.05) lines.push('');
  }
  return lines.join(eol) + eol;
}

describe('CSV read in two parts, joined', () => {
  it('finds the cut just past a line end: LF, CRLF, lone CR, and not on a CR that may precede an LF', () => {
    expect(lineEndAfter(enc('ab\ncd\n'), 0)).toBe(3);
    expect(lineEndAfter(enc('ab\ncd\n'), 3)).toBe(6);
    expect(lineEndAfter(enc('ab\r\ncd'), 1)).toBe(4);
    expect(lineEndAfter(enc('ab\rcd'), 0)).toBe(3);
    expect(lineEndAfter(enc('ab\r'), 0)).toBe(-1);
    expect(lineEndAfter(enc('abcd'), 0)).toBe(-1);
  });

  it('gives the single reader\'s table at every line cut, for text, ISO time, blank and marker cells, LF and CRLF', () => {
    const random = seededRandom(20261202);
    for (const crlf of [false, true]) {
      for (const precision of ['float64', 'float32'] as const) {
        const bytes = enc(studyText(random, 60, crlf, (i) => (i % 9 === 0 ? 'moved' : '')));
        const whole = readWhole(bytes, { ...COMMA, precision });
        expect(typeof whole).not.toBe('string');
        // The per-marker counts are part of the table, so the join must add them up too.
        const f0 = (whole as Table).missing?.find((m) => m.column === 'f0');
        expect(Object.keys(f0?.byMarker ?? {}).sort()).toEqual(['', '-', '?', 'N/A', 'NA']);
        let joined = 0;
        for (let cut = lineEndAfter(bytes, 0); cut > 0 && cut < bytes.length; cut = lineEndAfter(bytes, cut)) {
          for (const chunk of [7, 1 << 20]) {
            const two = readInTwo(bytes, cut, { ...COMMA, precision }, chunk);
            expect(two).toEqual(whole);
            joined++;
          }
        }
        expect(joined).toBeGreaterThan(100);
      }
    }
  });

  it('joins a column that is missing in one part and text or numbers in the other', () => {
    const text = 'id,a,b\n1,,x\n2,,\n3,4.5,y\n4,NA,\n';
    const bytes = enc(text);
    const whole = readWhole(bytes, COMMA);
    for (let cut = lineEndAfter(bytes, 0); cut > 0 && cut < bytes.length; cut = lineEndAfter(bytes, cut)) {
      expect(readInTwo(bytes, cut, COMMA, 3)).toEqual(whole);
    }
  });

  it('reads the rest with the first reader\'s missing-value markers, a list of one\'s own included', () => {
    const lines = ['id,f'];
    const counts = { gap: 0, '': 0 };
    for (let i = 0; i < 40; i++) {
      const cell = i % 5 === 0 ? 'gap' : i % 7 === 0 ? '' : String(i / 2);
      if (cell === 'gap' || cell === '') counts[cell]++;
      lines.push(`${i},${cell}`);
    }
    const bytes = enc(`${lines.join('\n')}\n`);
    const options = { ...COMMA, missing: ['gap'] };
    const whole = readWhole(bytes, options) as Table;
    expect(whole.missing).toEqual([{ column: 'f', total: counts.gap + counts[''], byMarker: counts }]);
    for (let cut = lineEndAfter(bytes, 0); cut > 0 && cut < bytes.length; cut = lineEndAfter(bytes, cut)) {
      expect(readInTwo(bytes, cut, options, 16)).toEqual(whole);
    }
  });

  it('declines to join where numbers and text meet in a column, so the caller reads on', () => {
    // "7" comes before the first text, "07" after it: a single reader spells the first as
    // JavaScript prints the number and keeps the second as written; a reader of the rest alone
    // cannot know which of its numbers follow text.
    const bytes = enc('id,label\n1,7\n2,walk\n3,run\n4,07\n');
    const cut = lineEndAfter(bytes, lineEndAfter(bytes, 0));
    expect(readInTwo(bytes, cut, COMMA, 64)).toBe('not joined');
    const whole = readWhole(bytes, COMMA) as Table;
    const label = whole.columns[1];
    expect(label.kind === 'categorical' && label.dictionary).toEqual(['7', 'walk', 'run', '07']);
  });

  it('reports the problem of either part on the file\'s own row: ragged row, unterminated quote, text in a feature, Inf', () => {
    const random = seededRandom(7);
    const base = studyText(random, 40, false, () => '').split('\n');
    // The last flag: whether any cut joins. Text among a feature's numbers never joins (see the
    // test above), so the single reader's error comes from reading on.
    const cases: [string, (lines: string[]) => void, boolean][] = [
      ['ragged', (l) => { l[30] += ',9'; }, true],
      ['unterminated quote', (l) => { l[33] = `${l[33].slice(0, -1)}"open`; }, true],
      ['text in a feature', (l) => { l[35] = l[35].replace(/,([^,]*),([^,]*),$/, ',$1,abc,'); }, false],
      ['Inf', (l) => { l[25] = l[25].replace(/,([^,]*),([^,]*),$/, ',$1,Inf,'); }, true],
    ];
    for (const [name, edit, joins] of cases) {
      const lines = base.slice();
      edit(lines);
      const bytes = enc(lines.join('\n'));
      const whole = readWhole(bytes, COMMA);
      expect(typeof whole).toBe('string');
      expect(whole).toMatch(/row \d+/);
      let joined = 0;
      for (let cut = lineEndAfter(bytes, 0); cut > 0 && cut < bytes.length; cut = lineEndAfter(bytes, cut)) {
        const two = readInTwo(bytes, cut, COMMA, 5);
        // A quote opened before the cut makes the cut unsafe: not joined, never a wrong table.
        if (two === 'not joined') continue;
        expect(two, `${name}, cut at byte ${cut}`).toBe(whole);
        joined++;
      }
      if (joins) expect(joined, name).toBeGreaterThan(20);
      else expect(joined, name).toBe(0);
    }
  });

  it('marks a part that opened a quoted cell, since its end may not be a record boundary', () => {
    const bytes = enc('id,note\n1,"a\nb"\n2,c\n');
    const cut = lineEndAfter(bytes, 10); // inside the quoted cell
    const first = new CsvReader('w.csv', COMMA);
    first.push(bytes.subarray(0, cut));
    expect(first.sawQuote).toBe(true);
    expect(first.pendingBytes).toBeGreaterThan(0);
  });
});
