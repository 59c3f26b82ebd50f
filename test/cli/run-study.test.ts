import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams } from '../../src/core/analysis.types';
import { analyze } from '../../src/core/analyze';
import { kmeans } from '../../src/core/cluster/kmeans';
import type { CurationAction } from '../../src/core/curation/curation.types';
import { studyExports } from '../../src/core/export/study-exports';
import { quietContext } from '../../src/core/job';
import { seededRandom } from '../../src/core/random';
import { encodeStudy } from '../../src/core/study/encode';
import type { Study } from '../../src/core/study/study.types';
import { parseCsv } from '../../src/core/table/csv';
import { featureMatrix } from '../../src/core/table/matrix';
import { inferRoles } from '../../src/core/table/roles';
import { applyRecipe } from '../../src/core/recipe/apply';
import { DEFAULT_RECIPE } from '../../src/core/recipe/recipe.types';
import { attachSubjects } from '../../src/cli/recipe-options';
import { ROOT, runCli, tempDir } from './run-cli';

const DEMO = join(ROOT, 'demo-data/windows.csv');

/** A demo study as the app saves it: one analysed run of the demo windows plus a mix of curation. */
async function demoStudy(): Promise<{ study: Study; table: ReturnType<typeof parseCsv> }> {
  const bytes = new Uint8Array(readFileSync(DEMO));
  const table = parseCsv(bytes, 'windows.csv');
  const roles = inferRoles(table);
  const matrix = featureMatrix(table, roles);
  attachSubjects(matrix, table, roles);
  const params: AnalysisParams = { ...DEFAULT_ANALYSIS_PARAMS, k: 4, seed: 11, restarts: 1 };
  const result = await analyze({ ...matrix, data: matrix.data.slice() }, params, quietContext);

  // Split cluster 2 as the app does: k-means (k = 2) on its members' scaled features.
  const scaled = await applyRecipe(matrix, { subjectCodes: matrix.subjectCodes }, DEFAULT_RECIPE);
  const members: number[] = [];
  result.labels.forEach((c, i) => { if (c === 2) members.push(i); });
  const sub = new Float64Array(members.length * scaled.d);
  members.forEach((w, j) => sub.set(scaled.data.subarray(w * scaled.d, (w + 1) * scaled.d), j * scaled.d));
  const split = await kmeans(sub, members.length, scaled.d, { k: 2, restarts: 2, maxIterations: 100, tol: 1e-4, random: seededRandom(5) });

  const actions: CurationAction[] = [
    { type: 'promote', cluster: 0, className: 'walking, outdoors' },
    { type: 'name', cluster: 1, name: 'maybe typing' },
    { type: 'colour', cluster: 1, colour: '#0072B2' },
    { type: 'split', cluster: 2, k: 2, parts: split.labels },
    { type: 'promote', cluster: 4, className: 'stairs "up"' },
    { type: 'set-aside', cluster: 3, value: true },
    { type: 'move', windows: Int32Array.from([0, 1, 2, 100]), to: 0 },
    { type: 'merge', into: 1, from: [2] },
  ];
  const study: Study = {
    schemaVersion: 1,
    app: { name: 'Gleaner', version: 'test' },
    inputs: [{ fileName: 'windows.csv', path: 'windows.csv', sha256: createHash('sha256').update(bytes).digest('hex'), rows: table.nRows }],
    runs: [{ id: 'run-1', input: 0, roles, params: { ...params }, result, curation: { actions, undone: [] }, flags: [], createdAt: '2026-01-01T00:00:00.000Z' }],
    activeRun: 0,
    notes: '',
    view: {},
  };
  return { study, table };
}

describe('gleaner run <study file>', () => {
  it('reproduces a saved demo study: per-window CSV, label-first list and events byte for byte as the app export code writes them', async () => {
    const { study, table } = await demoStudy();
    const dir = tempDir('run-study');
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    writeFileSync(join(dir, 'demo.gleaner'), encodeStudy(study));
    const out = join(dir, 'out');
    const r = runCli(['run', join(dir, 'demo.gleaner'), '--out', out, '--progress', 'none']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);

    // The app's export path: the same core function on the saved study (stored results, no recomputing).
    const expected = studyExports({ study, run: 0, table, appVersion: 'app', createdAt: '2026-01-01T00:00:00.000Z', events: true });
    const names = expected.map((f) => f.name);
    expect(names).toContain('windows-weak-labels.csv');
    expect(names).toContain('windows-events.tsv');
    for (const f of expected) {
      const got = readFileSync(join(out, 'run-1', f.name));
      if (f.name.endsWith('-provenance.json')) {
        const [a, b] = [JSON.parse(got.toString('utf8')), JSON.parse(f.data as string)];
        for (const p of [a, b]) { delete p.createdAt; delete p.app; }
        expect(a).toEqual(b);
      } else {
        expect(got.equals(Buffer.from(typeof f.data === 'string' ? new TextEncoder().encode(f.data) : f.data)), f.name).toBe(true);
      }
    }

    // The curation shows in the CSV: set-aside windows flagged, classes named, moved windows in
    // cluster 1 (index 0: clusters are numbered index + 1, as on screen).
    const lines = readFileSync(join(out, 'run-1', 'windows-weak-labels.csv'), 'utf8').trim().split('\n');
    expect(lines[0]).toBe('window_id,subject,session,start,end,cluster,cluster_name,class_name,confidence,set_aside,flags');
    expect(lines.slice(1, 4).map((l) => l.split(',')[5])).toEqual(['1', '1', '1']);
    expect(lines.some((l) => l.includes(',"walking, outdoors",'))).toBe(true);
    expect(lines.some((l) => l.includes(',"stairs ""up""",'))).toBe(true);
    // Rows without a quoted name split on commas: set_aside is the 10th cell.
    const aside = lines.slice(1).filter((l) => !l.includes('"') && l.split(',')[9] === '1');
    expect(aside.length).toBeGreaterThan(0);
    expect(aside.every((l) => l.split(',')[5] === '4')).toBe(true);
  });

  it('reports a changed input file by its hash and writes nothing (exit 1)', async () => {
    const { study } = await demoStudy();
    const dir = tempDir('run-changed');
    writeFileSync(join(dir, 'windows.csv'), `${readFileSync(DEMO, 'utf8')}\n`);
    writeFileSync(join(dir, 'demo.gleaner'), encodeStudy(study));
    const r = runCli(['run', join(dir, 'demo.gleaner'), '--out', join(dir, 'out'), '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(existsSync(join(dir, 'out'))).toBe(false);
    expect(r.stderr).toMatch(/^gleaner: windows\.csv: expected the input saved in demo\.gleaner \(SHA-256 [0-9a-f]{64}\), found "SHA-256 [0-9a-f]{12}.*\n$/);
  });

  it('names a missing study file and a bad command line', () => {
    const dir = tempDir('run-usage');
    expect(runCli(['run', '--out', dir]).status).toBe(2);
    const r = runCli(['run', join(dir, 'nope.gleaner'), '--out', dir]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^gleaner: cannot open .*nope\.gleaner: no such file or folder\n$/);
  });
});
