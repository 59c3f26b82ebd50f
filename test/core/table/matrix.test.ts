import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { parseCsv } from '../../../src/core/table/csv';
import { featureMatrix } from '../../../src/core/table/matrix';
import type { Roles } from '../../../src/core/table/roles.types';

const t = parseCsv(new TextEncoder().encode('s,a,b,c\nx,1,,3\ny,2,NA,4\nx,3,,5\n'), 'm.csv');
const role = (name: string, r: Roles[number]['role']) => ({ name, role: r, evidence: '' });

describe('featureMatrix(table, roles)', () => {
  it('gathers feature columns row-major with NaN for missing values', () => {
    const m = featureMatrix(t, [role('s', 'subject'), role('a', 'feature'), role('b', 'ignore'), role('c', 'feature')]);
    expect(m).toMatchObject({ n: 3, d: 2, featureNames: ['a', 'c'] });
    expect(Array.from(m.data)).toEqual([1, 3, 2, 4, 3, 5]);
  });

  it('rejects a table without feature columns', () => {
    expect(() => featureMatrix(t, [role('a', 'metadata')])).toThrow(InputError);
  });

  it('names a feature column that is entirely missing', () => {
    try {
      featureMatrix(t, [role('a', 'feature'), role('b', 'feature')]);
      throw new Error('expected an InputError');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).details).toMatchObject({ file: 'm.csv', column: 'b' });
      expect((e as Error).message).toContain('at least one value');
    }
  });
});
