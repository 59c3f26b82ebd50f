import { describe, expect, it } from 'vitest';
import { parseArgs, UsageError } from '../../src/cli/args';
import { OptionError } from '../../src/core/errors';
import { DEFAULT_ANALYSIS_PARAMS } from '../../src/core/analysis.types';
import { hasStackTrace, runCli } from './run-cli';

describe('parseArgs(argv)', () => {
  it('reads the analyze command with its flags, in both --flag value and --flag=value forms', () => {
    expect(parseArgs(['analyze', 'w.csv', '--k', '7', '--seed=3', '--out', 'o', '--restarts', '4'])).toMatchObject({
      command: 'analyze', input: 'w.csv', out: 'o', values: { k: 7, seed: 3, restarts: 4 }, progress: 'auto',
    });
  });

  it('reads --compose as a comma-separated list of columns, duplicates dropped', () => {
    expect(parseArgs(['analyze', 'w.csv', '--out', 'o', '--compose', 'device, site,device'])).toMatchObject({ compose: ['device', 'site'] });
    expect(() => parseArgs(['analyze', 'w.csv', '--out', 'o', '--compose', 'device,,site'])).toThrow(/invalid --compose/);
  });

  it('fills unset options from the analysis defaults', () => {
    const c = parseArgs(['analyze', '--out', 'o', 'w.csv']);
    expect(c).toMatchObject({ values: { k: DEFAULT_ANALYSIS_PARAMS.k, seed: DEFAULT_ANALYSIS_PARAMS.seed, restarts: DEFAULT_ANALYSIS_PARAMS.restarts } });
  });

  it('answers --help and --version before anything else', () => {
    expect(parseArgs(['analyze', '--k', 'x', '--help'])).toEqual({ command: 'help' });
    expect(parseArgs(['-V'])).toEqual({ command: 'version' });
  });

  const bad: [string[], RegExp][] = [
    [[], /missing command/],
    [['cluster', 'w.csv'], /unknown command "cluster"/],
    [['analyze', 'w.csv', '--out', 'o', '--kk', '3'], /unknown option "--kk"/],
    [['analyze', 'w.csv', '--out', 'o', '-k', '3'], /unknown option "-k"/],
    [['analyze', 'w.csv', '--out'], /--out needs a value/],
    [['analyze', 'w.csv', '--out', 'o', '--k', '--seed', '2'], /--k needs a value/],
    [['analyze', 'w.csv', '--out', 'o', '--k', '1'], /invalid --k: "1" \(expected an integer >= 2\)/],
    [['analyze', 'w.csv', '--out', 'o', '--k', '2.5'], /invalid --k: "2.5"/],
    [['analyze', 'w.csv', '--out', 'o', '--k', 'seven'], /invalid --k: "seven"/],
    [['analyze', 'w.csv', '--out', 'o', '--seed', '-1'], /invalid --seed: "-1"/],
    [['analyze', 'w.csv', '--out', 'o', '--restarts', '0'], /invalid --restarts: "0"/],
    [['analyze', 'w.csv', '--out', 'o', '--k', '3', '--k', '4'], /--k given twice/],
    [['analyze', '--out', 'o'], /missing input/],
    [['analyze', 'a.csv', 'b.csv', '--out', 'o'], /expected one input file/],
    [['analyze', 'w.csv'], /missing option --out/],
  ];
  for (const [argv, message] of bad) {
    it(`rejects ${JSON.stringify(argv)} with ${message}`, () => {
      // Flag-syntax mistakes are UsageErrors; values outside a parameter's range OptionErrors (both exit 2).
      expect(() => parseArgs(argv)).toThrow(/invalid --/.test(message.source) ? OptionError : UsageError);
      expect(() => parseArgs(argv)).toThrow(message);
    });
  }
});

describe('gleaner CLI flag errors (spawned)', () => {
  const cases: [string[], RegExp][] = [
    [['analyze', 'demo-data/windows.csv', '--out', 'test-output/never', '--k', '1'], /invalid --k: "1"/],
    [['analyze', 'demo-data/windows.csv', '--out', 'test-output/never', '--bogus'], /unknown option "--bogus"/],
    [['analyze', 'demo-data/windows.csv', '--out'], /--out needs a value/],
  ];
  for (const [argv, message] of cases) {
    it(`exits 2 with one line for ${argv.slice(3).join(' ')}`, () => {
      const r = runCli(argv);
      expect(r.status).toBe(2);
      const lines = r.stderr.trimEnd().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^gleaner: /);
      expect(lines[0]).toMatch(message);
      expect(hasStackTrace(r.stderr)).toBe(false);
    });
  }

  it('prints help on stdout and exits 0', () => {
    const r = runCli(['--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Usage: gleaner analyze <windows\.csv> --out <dir>/);
  });

  it('prints the package version', async () => {
    const { default: pkg } = await import('../../package.json', { with: { type: 'json' } });
    const r = runCli(['--version']);
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe(`gleaner ${pkg.version}`);
  });
});
