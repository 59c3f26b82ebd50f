import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

// The layering rule of eslint.config.js, checked on small sources placed (virtually) in each
// folder: each forbidden import must be reported, and each allowed one must pass.
const eslint = new ESLint({ cwd: process.cwd() });

async function problems(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.severity === 2).map((m) => `${m.ruleId}: ${m.message}`);
}

describe('import layering (eslint.config.js)', () => {
  it.each([
    ['src/core/x.ts', "import { readFileSync } from 'node:fs';\nexport const x = readFileSync;\n", /no-restricted-imports/],
    ['src/core/x.ts', "import { app } from 'electron';\nexport const x = app;\n", /no-restricted-imports/],
    ['src/core/x.ts', "export const x = document.title;\n", /no-restricted-globals/],
    ['src/core/x.ts', "export const x = Math.random();\n", /no-restricted-properties/],
    ['src/core/x.ts', "export const x = Date.now();\n", /no-restricted-properties/],
    ['src/core/x.ts', "import { jobs } from '../worker/jobs';\nexport const x = jobs;\n", /no-restricted-imports/],
    ['src/worker/x.ts', "import { Worker } from 'node:worker_threads';\nexport const x = Worker;\n", /no-restricted-imports/],
    ['src/app/x.ts', "import { ipcRenderer } from 'electron';\nexport const x = ipcRenderer;\n", /no-restricted-imports/],
    ['src/app/x.ts', "import { readFile } from 'node:fs/promises';\nexport const x = readFile;\n", /no-restricted-imports/],
    ['src/host/x.ts', "import { shell } from 'electron';\nexport const x = shell;\n", /no-restricted-imports/],
    ['src/cli/x.ts', "import { app } from 'electron';\nexport const x = app;\n", /no-restricted-imports/],
    ['src/cli/x.ts', "import { browserHost } from '../host/browser-host';\nexport const x = browserHost;\n", /no-restricted-imports/],
    ['electron/x.ts', "import { jobs } from '../src/worker/jobs';\nexport const x = jobs;\n", /no-restricted-imports/],
  ])('%s rejects %j', async (file, code, rule) => {
    const found = await problems(file, code);
    expect(found.some((p) => rule.test(p)), found.join('\n')).toBe(true);
  });

  it.each([
    ['src/core/x.ts', "import { seededRandom } from './random';\nexport const x = seededRandom(1)();\n"],
    ['src/worker/x.ts', "import { analyze } from '../core/analyze';\nexport const x = analyze;\n"],
    ['src/app/x.ts', "import { JobClient } from '../worker/client';\nexport const x = JobClient;\n"],
    ['src/cli/x.ts', "import { readFileSync } from 'node:fs';\nimport { jobs } from '../worker/jobs';\nexport const x = [readFileSync, jobs];\n"],
    ['electron/x.ts', "import { app } from 'electron';\nexport const x = app;\n"],
  ])('%s allows %j', async (file, code) => {
    expect(await problems(file, code)).toEqual([]);
  });
});
