/**
 * Writes test/fixtures/golden/demo-study.gleaner: a saved study of the demo windows (one k-means
 * run and a mix of curation: classes, a name, a colour, a split, a set-aside cluster, a move and a
 * merge), as the app saves one. `gleaner run` on it is one of the golden cases. Run once with
 * `node --import tsx test/golden/make-study.ts`; the file is committed, so the goldens do not
 * depend on the code that made it.
 */
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams } from '../../src/core/analysis.types';
import { analyze } from '../../src/core/analyze';
import { kmeans } from '../../src/core/cluster/kmeans';
import type { CurationAction } from '../../src/core/curation/curation.types';
import { quietContext } from '../../src/core/job';
import { seededRandom } from '../../src/core/random';
import { applyRecipe } from '../../src/core/recipe/apply';
import { DEFAULT_RECIPE } from '../../src/core/recipe/recipe.types';
import { subjectCodes } from '../../src/core/recipe/subject-codes';
import { encodeStudy } from '../../src/core/study/encode';
import type { Study } from '../../src/core/study/study.types';
import { parseCsv } from '../../src/core/table/csv';
import { featureMatrix } from '../../src/core/table/matrix';
import { inferRoles } from '../../src/core/table/roles';
import { findColumn } from '../../src/core/table/table';
import { GOLDEN_ROOT } from './store';

const ROOT = join(import.meta.dirname, '../..');
const bytes = new Uint8Array(readFileSync(join(ROOT, 'demo-data/windows.csv')));
const table = parseCsv(bytes, 'windows.csv');
const roles = inferRoles(table);
const matrix = featureMatrix(table, roles);
const subject = roles.find((r) => r.role === 'subject');
const column = subject ? findColumn(table, subject.name) : undefined;
if (column) matrix.subjectCodes = subjectCodes(column).codes;
const params: AnalysisParams = { ...DEFAULT_ANALYSIS_PARAMS, k: 5, seed: 7, restarts: 3 };
const result = await analyze({ ...matrix, data: matrix.data.slice() }, params, quietContext);

const scaled = await applyRecipe(matrix, { subjectCodes: matrix.subjectCodes }, DEFAULT_RECIPE);
const members: number[] = [];
result.labels.forEach((c, i) => { if (c === 2) members.push(i); });
const sub = new Float64Array(members.length * scaled.d);
members.forEach((w, j) => sub.set(scaled.data.subarray(w * scaled.d, (w + 1) * scaled.d), j * scaled.d));
const split = await kmeans(sub, members.length, scaled.d, { k: 2, restarts: 2, maxIterations: 100, tol: 1e-4, random: seededRandom(5) });

const actions: CurationAction[] = [
  { type: 'promote', cluster: 0, className: 'walking' },
  { type: 'name', cluster: 1, name: 'maybe typing' },
  { type: 'colour', cluster: 1, colour: '#0072B2' },
  { type: 'split', cluster: 2, k: 2, parts: split.labels },
  { type: 'promote', cluster: 5, className: 'stairs' },
  { type: 'set-aside', cluster: 3, value: true },
  { type: 'move', windows: Int32Array.from([0, 1, 2, 100]), to: 0 },
  { type: 'merge', into: 1, from: [4] },
];
const study: Study = {
  schemaVersion: 1,
  app: { name: 'Gleaner', version: '0.1.0' },
  inputs: [{ fileName: 'windows.csv', path: 'windows.csv', sha256: createHash('sha256').update(bytes).digest('hex'), rows: table.nRows }],
  runs: [{ id: 'run-1', input: 0, roles, params: { ...params }, result, curation: { actions, undone: [] }, flags: [], createdAt: '2026-01-01T00:00:00.000Z' }],
  activeRun: 0,
  notes: '',
  view: {},
};
writeFileSync(join(GOLDEN_ROOT, 'demo-study.gleaner'), encodeStudy(study));
