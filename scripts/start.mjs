// `npm start`: build what is missing or stale, then open Gleaner on the demo study. In Electron
// when its binary is installed; otherwise in browser mode: the built renderer served on loopback
// and opened in an installed Chromium-family browser as an app window. Ctrl-C stops it.
//
// Flags: --browser (browser mode even when Electron is installed), --no-open (serve only),
//        --port <n> (default 5317, or GLEANER_PORT; a free port when taken).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { delimiter, join } from 'node:path';
import { serveApp } from './serve.mjs';

const DEFAULT_PORT = 5317;
const args = process.argv.slice(2);
const flag = (name) => args.includes(name);
const portArg = args.indexOf('--port');
const port = Number(portArg >= 0 ? args[portArg + 1] : (process.env.GLEANER_PORT ?? DEFAULT_PORT));
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`start: invalid --port ${JSON.stringify(args[portArg + 1] ?? process.env.GLEANER_PORT)} (expected an integer 0-65535)`);
  process.exit(2);
}
const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
const npx = process.platform === 'win32' ? 'npx.cmd' : 'npx';

function run(cmd, cmdArgs) {
  console.log(`> ${cmd} ${cmdArgs.join(' ')}`);
  const r = spawnSync(cmd, cmdArgs, { stdio: 'inherit', shell: process.platform === 'win32' });
  if (r.status !== 0) {
    console.error(`start: "${cmd} ${cmdArgs.join(' ')}" failed`);
    process.exit(r.status ?? 1);
  }
}

/** Newest modification time of a file or of any file under a folder (0 when absent). */
function newest(path) {
  if (!existsSync(path)) return 0;
  const info = statSync(path);
  if (!info.isDirectory()) return info.mtimeMs;
  let t = 0;
  for (const entry of readdirSync(path)) t = Math.max(t, newest(join(path, entry)));
  return t;
}

// 1. Dependencies.
if (!existsSync('node_modules')) run(npm, [existsSync('package-lock.json') ? 'ci' : 'install']);

// 2. Renderer, when missing or older than its sources.
const builtAt = existsSync('dist/renderer/index.html') ? statSync('dist/renderer/index.html').mtimeMs : 0;
const sourcesAt = Math.max(newest('src'), newest('vite.config.ts'), newest('package.json'));
if (builtAt < sourcesAt) run(npx, ['vite', 'build']);
else console.log('renderer: dist/renderer is up to date');

// 3. Demo study (windows table and raw signals).
if (!existsSync('demo-data/raw') || !existsSync('demo-data/windows.csv')) {
  if (existsSync('demo-data/generate.ts')) run(npm, ['run', 'demo-data', '--', '--raw']);
  else console.log('demo: demo-data/generate.ts is not there yet; starting without generating the demo study');
}

// 4. Electron when its binary is installed (never require('electron'): it would try to download).
function electronBinary() {
  const pathFile = 'node_modules/electron/path.txt';
  if (!existsSync(pathFile)) return null;
  const exe = join('node_modules/electron/dist', readFileSync(pathFile, 'utf8').trim());
  return existsSync(exe) ? exe : null;
}

const electron = flag('--browser') ? null : electronBinary();
if (electron) {
  const { buildElectron } = await import('./build-electron.mjs');
  await buildElectron();
  console.log('electron: starting Gleaner on the demo study');
  const child = spawn(electron, ['.', '--demo'], { stdio: 'inherit' });
  const stop = () => child.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  child.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)));
} else {
  if (!flag('--browser')) console.log('electron: the Electron binary is not installed (`npm run electron:download` fetches it); starting in browser mode');
  await browserMode();
}

function findOnPath(names) {
  const dirs = (process.env.PATH ?? '').split(delimiter).filter(Boolean);
  const exts = process.platform === 'win32' ? ['.exe', '.cmd', ''] : [''];
  for (const name of names) {
    for (const dir of dirs) {
      for (const ext of exts) {
        const full = join(dir, name + ext);
        if (existsSync(full) && statSync(full).isFile()) return full;
      }
    }
  }
  return null;
}

function findBrowser() {
  const onPath = findOnPath(['chromium', 'chromium-browser', 'google-chrome', 'google-chrome-stable', 'microsoft-edge', 'microsoft-edge-stable', 'brave-browser', 'chrome', 'msedge']);
  if (onPath) return onPath;
  const known =
    process.platform === 'darwin'
      ? ['/Applications/Google Chrome.app/Contents/MacOS/Google Chrome', '/Applications/Chromium.app/Contents/MacOS/Chromium', '/Applications/Microsoft Edge.app/Contents/MacOS/Microsoft Edge']
      : process.platform === 'win32'
        ? [
            join(process.env['PROGRAMFILES(X86)'] ?? '', 'Microsoft/Edge/Application/msedge.exe'),
            join(process.env.PROGRAMFILES ?? '', 'Google/Chrome/Application/chrome.exe'),
            join(process.env.LOCALAPPDATA ?? '', 'Google/Chrome/Application/chrome.exe'),
          ]
        : [];
  return known.find((p) => existsSync(p)) ?? null;
}

async function listen() {
  try {
    return await serveApp({ port });
  } catch (err) {
    if (err?.code !== 'EADDRINUSE' || port === 0) throw err;
    console.log(`browser mode: port ${port} is taken; using a free one`);
    return serveApp({ port: 0 });
  }
}

async function browserMode() {
  if (!existsSync('dist/renderer/index.html')) {
    console.error('start: dist/renderer/index.html is missing after the build');
    process.exit(1);
  }
  const server = await listen();
  // The address carries this launch's key (scripts/serve.mjs): the demo's data needs it.
  const url = `${server.openUrl}?demo=1`;
  let browser = null;
  const headless = process.platform === 'linux' && !process.env.DISPLAY && !process.env.WAYLAND_DISPLAY;
  // Chromium refuses to run as root without turning its sandbox off; we do not turn it off.
  const root = process.platform === 'linux' && process.getuid?.() === 0;
  const exe = flag('--no-open') || headless || root ? null : findBrowser();
  if (exe) {
    // A profile of its own, so the app window opens even when the browser is already running.
    const profile = join(tmpdir(), 'gleaner-browser-profile');
    mkdirSync(profile, { recursive: true });
    browser = spawn(exe, [`--app=${url}`, `--user-data-dir=${profile}`, '--no-first-run', '--no-default-browser-check'], { stdio: 'ignore' });
    browser.on('error', (err) => console.log(`browser mode: could not start ${exe} (${err.message}); open ${url} yourself`));
    console.log(`browser mode: Gleaner is open in ${exe} at ${url}`);
  } else if (headless) {
    console.log(`browser mode: no display here; open ${url} in a Chromium-family browser (an SSH tunnel works: ssh -L ${new URL(server.url).port}:127.0.0.1:${new URL(server.url).port} <host>)`);
  } else if (root) {
    console.log(`browser mode: not opening a browser as root; open ${url} in Chromium, Chrome or Edge as your own user`);
  } else {
    console.log(`browser mode: open ${url} in Chromium, Chrome or Edge`);
  }
  console.log('browser mode: serving on loopback only, to this address only (its key changes at every start); press Ctrl-C to stop');
  const stop = async () => {
    if (browser && browser.exitCode === null) browser.kill('SIGTERM');
    // Browsers keep connections open; do not wait on them for long.
    await Promise.race([server.close(), new Promise((r) => setTimeout(r, 1000))]);
    process.exit(0);
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
