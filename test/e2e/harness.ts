/**
 * Starts the built renderer on a loopback server and a headless Chromium on it, for the
 * end-to-end tests. Builds dist/renderer first when it is missing (npm test builds it anyway).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const ROOT = resolve(import.meta.dirname, '../..');
export const OUTPUT = join(ROOT, 'test-output');

interface Served {
  url: string;
  close: () => Promise<void>;
}
type ServeApp = (o: { port?: number; root?: string; demoDir?: string }) => Promise<Served & { openUrl: string }>;

export interface Harness {
  page: Page;
  context: BrowserContext;
  /** The address the app is opened with (it carries the server's key for the demo's data). */
  url: string;
  /** A fresh temporary folder for files the test writes. */
  tempDir: string;
  /** Uncaught page errors seen so far (a working app has none). */
  pageErrors: string[];
  /** Console errors seen so far (a failed load of any resource shows here too). */
  consoleErrors: string[];
  close(): Promise<void>;
}

export async function startHarness(): Promise<Harness> {
  if (!existsSync(join(ROOT, 'dist/renderer/index.html'))) {
    execFileSync('npx', ['vite', 'build'], { cwd: ROOT, stdio: 'inherit' });
  }
  mkdirSync(OUTPUT, { recursive: true });
  // scripts/serve.mjs is plain JavaScript without type declarations: load it by URL.
  const serveModule = pathToFileURL(join(ROOT, 'scripts/serve.mjs')).href;
  const { serveApp } = (await import(serveModule)) as { serveApp: ServeApp };
  // The browser: /usr/bin/chromium or GLEANER_CHROMIUM (scripts/browser.mjs; npm test installs it when it can).
  const browserModule = pathToFileURL(join(ROOT, 'scripts/browser.mjs')).href;
  const { chromiumPath, missingMessage } = (await import(browserModule)) as { chromiumPath: () => string; missingMessage: (p: string, custom: boolean) => string };
  const executablePath = chromiumPath();
  if (!existsSync(executablePath)) throw new Error(missingMessage(executablePath, Boolean(process.env.GLEANER_CHROMIUM)));
  const server = await serveApp({ port: 0, root: join(ROOT, 'dist/renderer'), demoDir: join(ROOT, 'demo-data') });
  const tempDir = mkdtempSync(join(tmpdir(), 'gleaner-e2e-'));
  let context: BrowserContext;
  try {
    context = await chromium.launchPersistentContext(join(tempDir, 'profile'), {
      executablePath,
      headless: true,
      acceptDownloads: true,
      viewport: { width: 1400, height: 900 },
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
  } catch (err) {
    await server.close();
    rmSync(tempDir, { recursive: true, force: true });
    throw err;
  }
  const page = context.pages()[0] ?? (await context.newPage());
  await enableTestHook(page);
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(`${message.text()} (${message.location().url})`);
  });
  return {
    page,
    context,
    url: server.openUrl,
    tempDir,
    pageErrors,
    consoleErrors,
    async close() {
      // The profile and downloads go even when closing the browser fails.
      try {
        await context.close();
        await server.close();
      } finally {
        rmSync(tempDir, { recursive: true, force: true });
      }
    },
  };
}

/**
 * Asks the app on this page (from its next load on) to install its read-only test view,
 * `window.__gleaner` (src/app/test-hook.ts); without it the app never does.
 */
export async function enableTestHook(page: Page): Promise<void> {
  await page.addInitScript(() => { (window as unknown as { __gleanerWantsTestHook: boolean }).__gleanerWantsTestHook = true; });
}

/** Opens a file through the app's Open button and the browser's file chooser. */
export async function openThroughChooser(page: Page, path: string): Promise<void> {
  const [chooser] = await Promise.all([
    page.waitForEvent('filechooser'),
    page.getByRole('button', { name: 'Open…' }).click(),
  ]);
  await chooser.setFiles(path);
}

/** The test hook's values (see src/app/test-hook.ts). */
export interface HookState {
  pointsDrawn: number;
  clustersDrawn: number;
  windows: number;
  selectionSize: number;
  runCount: number;
  busy: boolean;
}

export function hookState(page: Page): Promise<HookState> {
  return page.evaluate(() => {
    const h = (window as unknown as { __gleaner: HookState }).__gleaner;
    return { pointsDrawn: h.pointsDrawn, clustersDrawn: h.clustersDrawn, windows: h.windows, selectionSize: h.selectionSize, runCount: h.runCount, busy: h.busy };
  });
}

/** Waits until the given number of runs has completed (and nothing is running). */
export async function waitForRuns(page: Page, runs: number, timeout = 120_000): Promise<void> {
  await page.waitForFunction(
    (n) => {
      const h = (window as unknown as { __gleaner: HookState }).__gleaner;
      return h.runCount >= n && !h.busy && h.pointsDrawn > 0;
    },
    runs,
    { timeout, polling: 100 },
  );
}

/** Opens a windows table through the chooser and waits until the app holds its windows. */
export async function openAndWait(page: Page, path: string): Promise<void> {
  await openThroughChooser(page, path);
  await page.waitForFunction(() => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows > 0, undefined, { timeout: 60_000 });
}

/** A harness whose page has the windows table at `path` open, all its `windows` rows read. */
export async function startWithTable(path: string, windows: number): Promise<Harness> {
  const h = await startHarness();
  await h.page.goto(h.url);
  await openThroughChooser(h.page, path);
  await h.page.waitForFunction((n) => (window as unknown as { __gleaner: { windows: number } }).__gleaner.windows === n, windows, { timeout: 60_000 });
  return h;
}
