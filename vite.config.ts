import { svelte } from '@sveltejs/vite-plugin-svelte';
import { defineConfig } from 'vite';

// The renderer: built to dist/renderer with relative paths, so it loads from local files or a
// custom protocol in Electron and from a loopback server in browser mode, never from a dev server.
export default defineConfig({
  root: 'src/app',
  base: './',
  plugins: [svelte()],
  publicDir: false,
  build: {
    outDir: '../../dist/renderer',
    emptyOutDir: true,
    target: 'es2022',
    sourcemap: true,
  },
  worker: { format: 'es' },
});
