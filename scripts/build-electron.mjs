// Builds electron/ into dist-electron/ as CommonJS: main.js and preload.js, each one bundled file
// (a sandboxed preload cannot require local modules). `electron` stays external. Type checking is
// separate: tsc -p electron/tsconfig.json --noEmit.
import { mkdirSync, writeFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { build } from 'esbuild';

/** esbuild options for both entry points; `write: false` keeps the output in memory (tests). */
export function electronBuildOptions({ outdir = 'dist-electron', write = true } = {}) {
  return {
    entryPoints: { main: 'electron/main.ts', preload: 'electron/preload.ts' },
    outdir,
    write,
    bundle: true,
    platform: 'node',
    format: 'cjs',
    // Electron 40 (package.json) embeds a Node at least as new as 22; node22 is safe for it.
    target: 'node22',
    external: ['electron'],
    sourcemap: write,
    logLevel: 'warning',
  };
}

export async function buildElectron({ outdir = 'dist-electron' } = {}) {
  mkdirSync(outdir, { recursive: true });
  // package.json says "type": "module"; this folder's .js files are CommonJS.
  writeFileSync(`${outdir}/package.json`, '{ "type": "commonjs" }\n');
  await build(electronBuildOptions({ outdir }));
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await buildElectron();
  console.log('electron: built dist-electron/main.js and dist-electron/preload.js');
}
