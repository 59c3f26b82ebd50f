// Shared by the browser suites (map, traces): builds one of the app's bench pages with Vite into a
// temp folder, serves it on loopback and opens it in headless Debian Chromium (software raster).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { build } from 'vite';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');

type ServeApp = (o: { port?: number; root?: string; demoDir?: string }) => Promise<{ url: string; openUrl: string; close: () => Promise<void> }>;

export interface BenchPageOptions {
  /** Entry module, relative to the repository (e.g. bench/pages/map-page.ts). */
  entry: string;
  /** Short name: the bundle's file name and the page title. */
  name: string;
  viewport: { width: number; height: number };
}

/**
 * Builds `entry` as an ES module page with one <canvas>, opens it, runs `use(page)`, then closes
 * the browser and server and removes the temp folder. Returns what `use` returned and the
 * browser's version.
 */
export async function withBenchPage<T>(options: BenchPageOptions, use: (page: Page) => Promise<T>): Promise<{ result: T; browser: string }> {
  const tmp = mkdtempSync(join(tmpdir(), `gleaner-${options.name}-bench-`));
  try {
    return await inTemp(tmp, options, use);
  } finally {
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function inTemp<T>(tmp: string, options: BenchPageOptions, use: (page: Page) => Promise<T>): Promise<{ result: T; browser: string }> {
  const site = join(tmp, 'site');
  const bundle = `${options.name}-bench.js`;
  await build({
    configFile: false,
    root: ROOT,
    logLevel: 'warn',
    build: {
      outDir: site,
      emptyOutDir: true,
      target: 'es2022',
      lib: { entry: join(ROOT, options.entry), formats: ['es'], fileName: () => bundle },
    },
  });
  writeFileSync(join(site, 'index.html'), `<!doctype html><meta charset="utf-8"><title>${options.name} bench</title>\n<body style="margin:0"><canvas></canvas><script type="module" src="./${bundle}"></script></body>\n`);
  const { serveApp } = (await import(pathToFileURL(join(ROOT, 'scripts/serve.mjs')).href)) as { serveApp: ServeApp };
  const server = await serveApp({ port: 0, root: site, demoDir: site });
  const { chromiumPath } = (await import(pathToFileURL(join(ROOT, 'scripts/browser.mjs')).href)) as { chromiumPath: () => string };
  const context = await chromium.launchPersistentContext(join(tmp, 'profile'), {
    executablePath: chromiumPath(),
    headless: true,
    viewport: options.viewport,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    page.on('pageerror', (e) => console.error(`bench page error: ${e.message}`));
    await page.goto(server.openUrl);
    const result = await use(page);
    return { result, browser: context.browser()?.version() ?? 'chromium' };
  } finally {
    await context.close();
    await server.close();
  }
}
