// Bundles electron/ in memory (scripts/build-electron.mjs, esbuild) and checks what each output
// may require at run time. Electron itself is never loaded.
import { builtinModules } from 'node:module';
import { basename } from 'node:path';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';
// @ts-expect-error: a plain .mjs build script without type declarations
import { electronBuildOptions } from '../../scripts/build-electron.mjs';

async function bundle(): Promise<Map<string, string>> {
  const result = await build({ ...electronBuildOptions({ outdir: 'dist-electron-test', write: false }), logLevel: 'silent' });
  return new Map((result.outputFiles ?? []).map((f) => [basename(f.path), f.text]));
}

function requiresOf(code: string): string[] {
  return [...new Set([...code.matchAll(/\brequire\("([^"]+)"\)/g)].map((m) => m[1]))].sort();
}

describe('electron bundle', () => {
  it('builds main.js and preload.js as CommonJS', async () => {
    const out = await bundle();
    expect([...out.keys()].sort()).toEqual(['main.js', 'preload.js']);
    for (const code of out.values()) {
      expect(code).not.toMatch(/^\s*(import|export)\s/m);
    }
  });

  it('the sandboxed preload requires nothing but electron, and exposes window.gleanerHost', async () => {
    // A sandboxed preload may require only "electron" and a few polyfilled modules, no local files:
    // Electron docs, "Process Sandboxing", "Preload scripts" (from memory).
    const preload = (await bundle()).get('preload.js')!;
    expect(requiresOf(preload)).toEqual(['electron']);
    expect(preload).toContain('exposeInMainWorld("gleanerHost"');
  });

  it('main requires only electron and Node built-ins (everything else is bundled)', async () => {
    const main = (await bundle()).get('main.js')!;
    const builtins = new Set(builtinModules.flatMap((m) => [m, `node:${m}`]));
    for (const dep of requiresOf(main)) expect(dep === 'electron' || builtins.has(dep), dep).toBe(true);
    expect(requiresOf(main)).toContain('electron');
  });
});
