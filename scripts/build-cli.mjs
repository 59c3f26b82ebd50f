// Builds the command-line runner into dist-cli/: main.js (the entry bin/gleaner.js loads),
// thread-entry.js (the job worker thread) and csv-part-thread.js (the second reader of a large
// CSV), with the core and its libraries bundled in and only Node built-ins left external. Shared
// chunks sit beside the entries, so a thread entry resolves as ./<name>.js from any of them.
// `npm run build:cli`.
import { pathToFileURL } from 'node:url';
import { build } from 'vite';

const outDir = 'dist-cli';

export async function buildCli() {
  await build({
    configFile: false,
    logLevel: 'warn',
    ssr: { noExternal: true, target: 'node' },
    build: {
      ssr: true,
      target: 'node20',
      outDir,
      emptyOutDir: true,
      minify: false,
      sourcemap: true,
      rolldownOptions: {
        input: { main: 'src/cli/main.ts', 'thread-entry': 'src/cli/thread-entry.ts', 'csv-part-thread': 'src/cli/csv-part-thread.ts' },
        output: { format: 'es', entryFileNames: '[name].js', chunkFileNames: '[name]-[hash].js' },
      },
    },
  });
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await buildCli();
  console.log(`cli: built ${outDir}/main.js, ${outDir}/thread-entry.js and ${outDir}/csv-part-thread.js`);
}
