// The Chromium the browser tests drive (playwright-core never downloads one): /usr/bin/chromium,
// Debian's package, or the executable GLEANER_CHROMIUM names. `npm test` calls ensureBrowser()
// first: when the browser is missing and this is Debian run as root, it installs the package with
// apt-get; otherwise it stops with one line saying what to install.
//
//   node scripts/browser.mjs            check, installing when it can (what npm test does)
//   node scripts/browser.mjs --dry-run  say what it would do, change nothing
import { spawnSync } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import { pathToFileURL } from 'node:url';

export const DEFAULT_CHROMIUM = '/usr/bin/chromium';
/** Debian packages: the browser, and a font so that screenshots have readable text. */
export const APT_PACKAGES = ['chromium', 'fonts-dejavu-core'];
const APT_GET = '/usr/bin/apt-get';

/** The Chromium executable for the tests: GLEANER_CHROMIUM when set, else /usr/bin/chromium. */
export function chromiumPath(env = process.env) {
  return env.GLEANER_CHROMIUM || DEFAULT_CHROMIUM;
}

function executable(path) {
  try {
    accessSync(path, constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** What this machine offers; tests pass their own. */
export function machine(env = process.env) {
  return {
    env,
    platform: process.platform,
    isRoot: process.getuid?.() === 0,
    executable,
    run: (cmd, args, extraEnv) => spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, ...extraEnv } }).status === 0,
  };
}

/** The one line printed when no browser can be had: what to install, or what to point at. */
export function missingMessage(path, custom) {
  if (custom) return `browser tests: GLEANER_CHROMIUM=${path} is not an executable; point it at a Chromium executable, or unset it to use ${DEFAULT_CHROMIUM}`;
  return `browser tests: no Chromium at ${DEFAULT_CHROMIUM}; install Debian's package (as root: apt-get install ${APT_PACKAGES.join(' ')}) or set GLEANER_CHROMIUM to a Chromium executable`;
}

/**
 * Makes sure the tests' Chromium is there. Installs Debian's package with apt-get when the default
 * path is missing and this is Linux, run as root, with apt-get present; `dryRun` only reports.
 * @param {ReturnType<typeof machine>} m
 * @param {{ dryRun?: boolean, log?: (line: string) => void }} [options]
 * @returns {{ ok: true, path: string, installed: boolean } | { ok: false, message: string, plan?: string[] }}
 */
export function ensureBrowser(m, { dryRun = false, log = console.log } = {}) {
  const path = chromiumPath(m.env);
  const custom = Boolean(m.env.GLEANER_CHROMIUM);
  if (m.executable(path)) return { ok: true, path, installed: false };
  const canApt = !custom && m.platform === 'linux' && m.isRoot && m.executable(APT_GET);
  if (!canApt) return { ok: false, message: missingMessage(path, custom) };
  const plan = [`${APT_GET} update`, `${APT_GET} install -y ${APT_PACKAGES.join(' ')}`];
  if (dryRun) return { ok: false, message: `browser tests: no Chromium at ${path}; would run: ${plan.join(' && ')}`, plan };
  log(`browser tests: no Chromium at ${path}; installing Debian's ${APT_PACKAGES.join(' ')} with apt-get`);
  const aptEnv = { DEBIAN_FRONTEND: 'noninteractive' };
  const done = m.run(APT_GET, ['update', '-qq'], aptEnv) && m.run(APT_GET, ['install', '-y', '-qq', ...APT_PACKAGES], aptEnv);
  if (done && m.executable(path)) return { ok: true, path, installed: true };
  return { ok: false, message: `browser tests: installing ${APT_PACKAGES.join(' ')} with apt-get failed; ${missingMessage(path, false).replace(/^browser tests: /, '')}` };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const r = ensureBrowser(machine(), { dryRun: process.argv.includes('--dry-run') });
  console.log(r.ok ? `browser tests: Chromium at ${r.path}${r.installed ? ' (installed now)' : ''}` : r.message);
  process.exit(r.ok ? 0 : 1);
}
