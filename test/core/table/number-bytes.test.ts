import { describe, expect, it } from 'vitest';
import { parseNumberBytes } from '../../../src/core/table/number-bytes';
import { seededRandom } from '../../../src/core/random';

const enc = new TextEncoder();
const parse = (s: string, point = 0x2e) => {
  const b = enc.encode(s);
  return parseNumberBytes(b, 0, b.length, point);
};

describe('parseNumberBytes(bytes, start, end, point)', () => {
  it('equals Number(text) (ECMA-262 StringToNumber, correctly rounded) on written decimals', () => {
    const cases = ['0', '-0', '12', '-3.5', '.5', '5.', '1e-3', '+2.0E+5', '0.1', '0.3', '123456789012345678', '9007199254740993',
      '1.7976931348623157e308', '5e-324', '2.2250738585072014e-308', '0.000001234567', '-98765.4321e-12', '3.141592653589793238462643'];
    const random = seededRandom(7);
    for (let i = 0; i < 2000; i++) cases.push(((random() - 0.5) * 10 ** Math.floor(random() * 12 - 4)).toFixed(Math.floor(random() * 10)));
    for (let i = 0; i < 500; i++) cases.push(String((random() - 0.5) * 1e-5), (random() * 1e20).toExponential(12));
    for (const s of cases) expect(Object.is(parse(s), Number(s)) ? s : `${s} → ${parse(s)} vs ${Number(s)}`).toBe(s);
  });

  it('reads a decimal comma when told to', () => {
    expect(parse('-0,25', 0x2c)).toBe(-0.25);
    expect(parse('1,5e3', 0x2c)).toBe(1500);
    expect(parse('1.5', 0x2c)).toBeNaN();
  });

  it('returns NaN for cells that are not numbers', () => {
    for (const s of ['', '-', '.', 'e5', '1e', '1e+', '12a', '0x10', '1,5', 'NaN', 'Inf', '1 2', '--1']) expect(parse(s)).toBeNaN();
  });
});
