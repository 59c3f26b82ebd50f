/**
 * The parameter schema (src/core/params) is the one definition of each parameter: this walks it
 * and checks that the CLI usage and the run panel show what it says, and that its rules hold.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ANALYZE, USAGE } from '../../../src/cli/args';
import { RUN, RUN_USAGE } from '../../../src/cli/run-command';
import { SWEEP, SWEEP_USAGE } from '../../../src/cli/sweep-command';
import { DEFAULT_ANALYSIS_PARAMS } from '../../../src/core/analysis.types';
import { LINKAGES } from '../../../src/core/cluster/hierarchy/merge-tree';
import { TSNE_DEFAULTS } from '../../../src/core/embed/tsne/options';
import { UMAP_DEFAULTS } from '../../../src/core/embed/umap/options';
import { OptionError } from '../../../src/core/errors';
import { accepts, checkParam, INPUT_PARAMS, PANEL_PARAMS, PARAMS, parseFlag, STABILITY_PARAMS, type ParamSpec } from '../../../src/core/params';

const ROOT = join(import.meta.dirname, '../../..');
const ALL: ParamSpec[] = [...Object.values(PARAMS), ...Object.values(INPUT_PARAMS), ...Object.values(STABILITY_PARAMS)];

describe('the parameter schema', () => {
  it('names every parameter and flag once, and each default passes its own rule', () => {
    expect(new Set(ALL.map((s) => s.name)).size).toBe(ALL.length);
    expect(new Set(ALL.map((s) => s.flag)).size).toBe(ALL.length);
    for (const s of ALL) {
      if (s.kind !== 'text' && s.kind !== 'list') expect(accepts(s, s.default), s.name).toBe(true);
      if (s.panel) {
        expect(accepts(s, s.panel.min), `${s.name} panel min`).toBe(true);
        if (s.panel.max !== undefined) expect(accepts(s, s.panel.max), `${s.name} panel max`).toBe(true);
      }
    }
  });

  it('is where the defaults of the runs and of the kernels come from', () => {
    expect(DEFAULT_ANALYSIS_PARAMS).toEqual({ k: 8, seed: 1, restarts: 10, maxIterations: 300, silhouetteSample: 2000 });
    expect([TSNE_DEFAULTS.perplexity, TSNE_DEFAULTS.iterations]).toEqual([PARAMS.perplexity.default, PARAMS.iterations.default]);
    expect([UMAP_DEFAULTS.neighbors, UMAP_DEFAULTS.minDist, UMAP_DEFAULTS.metric]).toEqual([PARAMS.neighbors.default, PARAMS.minDist.default, PARAMS.metric.default]);
    expect(PARAMS.cluster.choices.map((c) => c.value)).toEqual(['kmeans', ...LINKAGES, 'hdbscan']);
  });

  it('gives one rule per parameter: perplexity is a number above 0 from the flag, in the core and in the panel range', () => {
    expect(parseFlag(PARAMS.perplexity, '0.5')).toBe(0.5);
    expect(() => parseFlag(PARAMS.perplexity, '0')).toThrow('invalid --perplexity: "0" (expected a number > 0)');
    expect(() => checkParam(PARAMS.perplexity, 0)).toThrow(OptionError);
    expect(() => checkParam(PARAMS.perplexity, 1, { range: 'panel', shownAs: 'Perplexity' })).toThrow('invalid Perplexity: 1 (expected a number from 2 to 200)');
    expect(checkParam(PARAMS.perplexity, 30, { range: 'panel' })).toBe(30);
  });

  it('lists every flag of analyze, sweep and run in their usage, with the schema default', () => {
    for (const [command, usage] of [[ANALYZE, USAGE], [SWEEP, SWEEP_USAGE], [RUN, RUN_USAGE]] as const) {
      for (const { spec } of command.flags) {
        const line = usage.split('\n').find((l) => l.startsWith(`  --${spec.flag}${spec.meta ? ` ${spec.meta}` : ''} `));
        expect(line, `--${spec.flag} in ${command.name} usage`).toBeDefined();
        const block = usage.slice(usage.indexOf(line!), usage.indexOf(line!) + 400);
        if (/\(default \d/.test(block.split('\n  --')[0])) expect(block).toContain(`(default ${String(spec.default)}`);
      }
    }
  });

  it('shows in the run panel exactly the parameters that have a panel label, each through the schema', () => {
    const panel = readFileSync(join(ROOT, 'src/app/components/ParamsPanel.svelte'), 'utf8');
    const labelled = (Object.keys(PARAMS) as (keyof typeof PARAMS)[]).filter((n) => 'label' in PARAMS[n]);
    expect([...labelled].sort()).toEqual([...PANEL_PARAMS].sort());
    for (const name of PANEL_PARAMS) expect(panel, `P.${name} in ParamsPanel.svelte`).toMatch(new RegExp(`spec=\\{P\\.${name}\\}`));
    // Labels and limits are never written in the panel itself.
    expect(panel).not.toMatch(/min=\{|max=\{|<label for="param-(?!cut-by)/);
  });
});
