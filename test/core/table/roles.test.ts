import { describe, expect, it } from 'vitest';
import { OptionError } from '../../../src/core/errors';
import { parseCsv } from '../../../src/core/table/csv';
import { inferRoles, nameWords } from '../../../src/core/table/roles';

const table = parseCsv(
  new TextEncoder().encode(
    [
      'window_id,participant,session,t_start,t_end,device,acc_mean,acc_sd,activity,notes',
      'w1,P01,s1,0,5,wrist,0.1,1.0,walk,',
      'w2,P01,s1,5,10,wrist,0.2,1.1,,',
      'w3,P01,s2,10,15,wrist,0.3,1.2,,',
      'w4,P02,s1,0,5,ankle,0.4,1.3,,',
      'w5,P02,s1,5,10,ankle,0.5,1.4,sit,',
      'w6,P02,s2,10,15,ankle,0.6,1.5,,',
    ].join('\n'),
  ),
  'small.csv',
);

describe('inferRoles(table, overrides)', () => {
  it('splits names into words', () => {
    expect(nameWords('windowStartS')).toEqual(['window', 'start', 's']);
    expect(nameWords('Subject ID')).toEqual(['subject', 'id']);
  });

  it('infers every role of a small windows table, with evidence', () => {
    const roles = inferRoles(table);
    expect(roles.map((r) => [r.name, r.role])).toEqual([
      ['window_id', 'id'],
      ['participant', 'subject'],
      ['session', 'session'],
      ['t_start', 'start'],
      ['t_end', 'end'],
      ['device', 'metadata'],
      ['acc_mean', 'feature'],
      ['acc_sd', 'feature'],
      ['activity', 'label'],
      ['notes', 'ignore'],
    ]);
    // Free text is ignored by its name; an empty column without such a name stays a feature so
    // that the analysis reports it by name instead of running silently without it.
    const empty = parseCsv(new TextEncoder().encode('id,x,y\na,1,\nb,2,\n'), 'e.csv');
    expect(inferRoles(empty).map((r) => r.role)).toEqual(['id', 'feature', 'feature']);
    expect(roles[1].evidence).toContain('2 distinct text values, in runs');
    expect(roles[8].evidence).toContain('67% missing');
    for (const r of roles) expect(r.evidence.length).toBeGreaterThan(0);
  });

  it('lets overrides win and keeps one-per-table roles unique', () => {
    const roles = inferRoles(table, { device: 'subject', t_end: 'feature' });
    expect(roles.find((r) => r.name === 'device')).toEqual({ name: 'device', role: 'subject', evidence: 'set by you' });
    expect(roles.find((r) => r.name === 'participant')?.role).toBe('metadata');
    expect(roles.find((r) => r.name === 't_end')?.role).toBe('feature');
  });

  it('rejects overrides naming unknown columns or roles', () => {
    expect(() => inferRoles(table, { nope: 'feature' })).toThrow(OptionError);
    expect(() => inferRoles(table, { device: 'colour' as never })).toThrow(/one of id, subject/);
  });

  it('finds unnamed text ids and row counters from content', () => {
    const t = parseCsv(new TextEncoder().encode('n,key,x\n0,a,1\n1,b,2\n2,c,1\n'), 'c.csv');
    expect(inferRoles(t).map((r) => r.role)).toEqual(['id', 'metadata', 'feature']);
  });
});

describe('inferRoles: distinct counts', () => {
  it('counts distinct numbers as a JavaScript Set does (SameValueZero: -0 is 0, NaN is missing), Float32 and Float64', async () => {
    const { seededRandom } = await import('../../../src/core/random');
    const random = seededRandom(5);
    for (const make of [(n: number) => new Float64Array(n), (n: number) => new Float32Array(n)]) {
      for (const spread of [3, 50, 5000, 1e9]) {
        const n = 40_000; // a hash table of 2^17 slots: -0 and 0 differ in bits the slot index uses
        const values = make(n);
        for (let i = 0; i < n; i++) {
          const u = random();
          values[i] = u < 0.02 ? NaN : u < 0.04 ? -0 : u < 0.06 ? 0 : Math.floor(random() * spread) / 7;
        }
        const want = new Set(Array.from(values).filter((v) => !Number.isNaN(v))).size;
        const t = { fileName: 'n.csv', nRows: n, columns: [{ kind: 'numeric' as const, name: 'x', values }] };
        const [role] = inferRoles(t);
        expect(role.evidence).toMatch(new RegExp(`; ${want} distinct numeric value`));
      }
    }
  });
});
