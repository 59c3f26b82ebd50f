// Lint, including what each folder may import from packages (Node built-ins, electron) and the
// core's forbidden globals. Which of our own folders may import which is an allow list in
// test/lint/layers.test.ts (see DEVELOPERS.md, "Layers").
import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const nodeBuiltins = ['node:*', 'fs', 'fs/*', 'path', 'os', 'child_process', 'worker_threads', 'crypto', 'url', 'http', 'stream', 'util', 'events', 'zlib', 'readline', 'process', 'buffer'];

/** A no-restricted-imports rule: `patterns` are forbidden, each group with its reason. */
function layer(groups) {
  return {
    'no-restricted-imports': [
      'error',
      { patterns: groups.map(([group, message]) => ({ group, message })) },
    ],
  };
}

const noElectron = [['electron', 'electron/*'], 'Only electron/ may import electron.'];
const noNode = [nodeBuiltins, 'This layer runs in a browser or worker: no Node built-ins.'];
const noApp = [['**/app/**', '*.svelte'], 'The renderer (src/app) is not importable from this layer.'];
const noCli = [['**/cli/**'], 'The CLI (src/cli) is not importable from this layer.'];
const noHost = [['**/host/**'], 'The host interface (src/host) is not importable from this layer.'];
const noWorker = [['**/worker/**'], 'The worker layer is not importable from this layer.'];
const noElectronDir = [['**/electron/**'], 'electron/ is only loaded by Electron itself.'];

export default tseslint.config(
  { ignores: ['dist/**', 'dist-electron/**', 'dist-cli/**', 'release/**', 'node_modules/**', 'test-output/**', 'demo-data/raw/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...svelte.configs['flat/recommended'],
  {
    files: ['**/*.svelte', '**/*.svelte.ts'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.es2022 } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  // Pure core: typed arrays and math only. No DOM, Node, electron, clock or unseeded randomness.
  {
    files: ['src/core/**'],
    rules: {
      ...layer([noElectron, noNode, noApp, noCli, noHost, noWorker, noElectronDir]),
      'no-restricted-globals': ['error', 'window', 'document', 'navigator', 'process', 'Buffer', 'require', 'self', 'fetch', 'localStorage'],
      'no-restricted-properties': [
        'error',
        { object: 'Math', property: 'random', message: 'Core randomness is seeded: take a Random from core/random.ts.' },
        { object: 'Date', property: 'now', message: 'Core is clock-free: take time from the caller.' },
        { object: 'performance', property: 'now', message: 'Core is clock-free: take time from the caller.' },
      ],
    },
  },
  // Worker: the job protocol and entry; core only.
  {
    files: ['src/worker/**'],
    languageOptions: { globals: { ...globals.worker } },
    rules: layer([noElectron, noNode, noApp, noCli, noHost, noElectronDir]),
  },
  // Host interface and its browser implementation.
  {
    files: ['src/host/**'],
    languageOptions: { globals: { ...globals.browser } },
    rules: layer([noElectron, noNode, noApp, noCli, noWorker, noElectronDir]),
  },
  // Renderer.
  {
    files: ['src/app/**'],
    languageOptions: { globals: { ...globals.browser } },
    rules: layer([noElectron, noNode, noCli, noElectronDir]),
  },
  // CLI: Node; core and worker protocol, never the renderer or electron.
  {
    files: ['src/cli/**', 'bin/**', 'scripts/**', 'demo-data/**', 'bench/**', 'test/**', '*.config.*'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['src/cli/**', 'demo-data/**', 'bench/**', 'scripts/**'],
    ignores: ['bench/pages/**'],
    rules: layer([noElectron, noApp, noHost, noElectronDir]),
  },
  // The browser bench suites' pages: built by Vite, run in Chromium, drawing with the app's code.
  {
    files: ['bench/pages/**'],
    languageOptions: { globals: { ...globals.browser } },
    rules: layer([noElectron, noNode, noCli, noHost, noElectronDir]),
  },
  // Electron main and preload.
  {
    files: ['electron/**'],
    languageOptions: { globals: { ...globals.node } },
    rules: layer([noApp, noCli, noWorker, noHost]),
  },
);
