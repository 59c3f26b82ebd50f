import { describe, expect, it } from 'vitest';
import { csvField, formatNumber, toCsv } from '../../../src/core/export/csv';

describe('toCsv(header, rows)', () => {
  it('leaves plain fields bare and keeps spaces (RFC 4180 §2 rule 4: spaces are part of a field)', () => {
    expect(toCsv(['a', 'b'], [[' x ', 'y']])).toBe('a,b\n x ,y\n');
  });

  it('quotes fields holding a comma (RFC 4180 §2 rule 6)', () => {
    expect(csvField('walk,fast')).toBe('"walk,fast"');
  });

  it('quotes fields holding CR or LF (RFC 4180 §2 rule 6)', () => {
    expect(csvField('line1\nline2')).toBe('"line1\nline2"');
    expect(csvField('line1\r\nline2')).toBe('"line1\r\nline2"');
  });

  it('doubles quotes inside a quoted field (RFC 4180 §2 rule 7, its example "aaa","b""bb","ccc")', () => {
    // RFC 4180 §2 rule 7 example record: "aaa","b""bb","ccc". We quote only when needed (rule 5
    // makes quoting optional), so the plain fields stay bare.
    expect(toCsv(['h1', 'h2', 'h3'], [['aaa', 'b"bb', 'ccc']])).toBe('h1,h2,h3\naaa,"b""bb",ccc\n');
  });

  it('writes one record per line, header first, every line ended (RFC 4180 §2 rules 1-3; "\\n" instead of CRLF by choice)', () => {
    const text = toCsv(['id', 'v'], [['w1', 1], ['w2', 2.5]]);
    expect(text.split('\n')).toEqual(['id,v', 'w1,1', 'w2,2.5', '']);
  });

  it('writes empty strings as empty fields', () => {
    expect(toCsv(['a', 'b', 'c'], [['', 'x', '']])).toBe('a,b,c\n,x,\n');
  });

  it('rejects a row whose length differs from the header (every record has the same field count, RFC 4180 §2 rule 4)', () => {
    expect(() => toCsv(['a', 'b'], [['1']])).toThrow(/1 fields, header has 2/);
  });
});

describe('formatNumber(value, digits)', () => {
  it('rounds to significant digits and drops trailing zeros', () => {
    expect(formatNumber(Math.PI)).toBe('3.141593');
    expect(formatNumber(Math.PI, 3)).toBe('3.14');
    expect(formatNumber(0.5)).toBe('0.5');
    expect(formatNumber(-1234.56789, 5)).toBe('-1234.6');
  });

  it('writes integers in full, -0 as 0 and missing values as empty', () => {
    expect(formatNumber(1700000000)).toBe('1700000000');
    expect(formatNumber(-0)).toBe('0');
    expect(formatNumber(NaN)).toBe('');
    expect(formatNumber(Infinity)).toBe('');
  });

  it('uses no locale: no thousands separator, "." as decimal point (ECMAScript Number::toString)', () => {
    expect(formatNumber(12345.678)).toBe('12345.68');
    expect(formatNumber(1.5e-9)).toBe('1.5e-9');
  });
});
