/**
 * Golden outputs of the command line (test/golden/cli-cases.ts): every file written and every
 * line printed must stay byte-identical to test/fixtures/golden/<case>/ (GLEANER_GOLDEN_WRITE=1
 * rewrites them). The CLI runs as a bundle (golden/built-cli.ts), the cases a few at a time. Masked, because they legitimately vary: the temporary folder's path in printed
 * lines (the CLI runs in that folder with relative paths, so files written name none), and `createdAt` (the export time) in `gleaner run`'s provenance JSON.
 */
import { copyFileSync, existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildCliBundle, runBundled } from '../golden/built-cli';
import { CLI_CASES } from '../golden/cli-cases';
import { checkGolden, GOLDEN_ROOT, maskText, readOutputs, type Outputs } from '../golden/store';
import { ROOT, tempDir } from './run-cli';

const CREATED_AT = /"createdAt": "\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z"/g;

describe.concurrent('golden outputs of the command line', { timeout: 600_000 }, () => {
  let main = '';
  beforeAll(async () => {
    main = await buildCliBundle();
  }, 120_000);
  for (const c of CLI_CASES) {
    it(`${c.name}: ${c.args({ demo: 'windows.csv', study: 'demo.gleaner', recipe: 'recipe.json', out: 'out' }).join(' ')}`, async () => {
      const dir = tempDir('golden');
      copyFileSync(join(ROOT, 'demo-data/windows.csv'), join(dir, 'windows.csv'));
      copyFileSync(join(GOLDEN_ROOT, 'demo-study.gleaner'), join(dir, 'demo.gleaner'));
      copyFileSync(join(GOLDEN_ROOT, 'recipe.json'), join(dir, 'recipe.json'));
      mkdirSync(join(dir, 'work'));
      const out = join(dir, 'work', 'out');
      const r = await runBundled(main, c.args({ demo: 'windows.csv', study: 'demo.gleaner', recipe: 'recipe.json', out: 'work/out' }), dir);
      expect(r.status, r.stderr).toBe(c.status ?? 0);
      const paths: [string, string][] = [[dir, '<tmp>']];
      const outputs: Outputs = new Map();
      if (existsSync(out)) {
        for (const [name, data] of readOutputs(out)) {
          outputs.set(`out/${name}`, name.endsWith('provenance.json') ? maskText(data, [[CREATED_AT, '"createdAt": "<masked>"']]) : data);
        }
      }
      outputs.set('stdout.txt', maskText(Buffer.from(r.stdout), paths));
      outputs.set('stderr.txt', maskText(Buffer.from(r.stderr), paths));
      outputs.set('status.txt', Buffer.from(`${r.status}\n`));
      expect(checkGolden(`cli/${c.name}`, outputs)).toEqual([]);
    }, 600_000);
  }
});
