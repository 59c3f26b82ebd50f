/** The command line of `gleaner apply`: what it takes, what it refuses, and where each input's labels go. */
import { describe, expect, it } from 'vitest';
import { labelsFileName, parseApplyArgs } from '../../src/cli/apply-command';

describe('gleaner apply arguments', () => {
  it('takes a study, inputs and the flags', () => {
    expect(parseApplyArgs(['s.gleaner', 'a.parquet', 'b.csv', '--out', 'o', '--run', 'run-2', '--study-input', 'w.csv', '--progress', 'none'])).toEqual({
      study: 's.gleaner', inputs: ['a.parquet', 'b.csv'], out: 'o', run: 'run-2', studyInput: 'w.csv', progress: 'none',
    });
    expect(parseApplyArgs(['s.gleaner', '--help'])).toBeNull();
  });

  it('refuses a missing study, input or --out, and unknown flags', () => {
    expect(() => parseApplyArgs(['--out', 'o'])).toThrow('missing study: expected "apply <study file> <input>... --out <dir>"');
    expect(() => parseApplyArgs(['s.gleaner', '--out', 'o'])).toThrow('missing input: expected "apply <study file> <input>... --out <dir>"');
    expect(() => parseApplyArgs(['s.gleaner', 'a.csv'])).toThrow('missing option --out <dir>');
    expect(() => parseApplyArgs(['s.gleaner', 'a.csv', '--out', 'o', '--k', '3'])).toThrow('unknown option "--k" for apply');
  });

  it('names each output after its input without the extension', () => {
    expect(labelsFileName('data/subject=S01/part-0.parquet')).toBe('part-0.labels.csv');
    expect(labelsFileName('windows.csv')).toBe('windows.labels.csv');
    expect(labelsFileName('cohort.v2.arrow')).toBe('cohort.v2.labels.csv');
    expect(labelsFileName('dataset/')).toBe('dataset.labels.csv');
    expect(labelsFileName('.hidden')).toBe('.hidden.labels.csv');
  });
});
