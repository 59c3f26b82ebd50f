// The Dask test (test/cli/dask-apply.test.ts) runs examples/dask-apply.py under Debian's Python
// with Dask's distributed package. `npm test` calls ensureDask() after ensureBrowser(): when the
// package is missing and this is Debian run as root, it installs python3-distributed with apt-get;
// otherwise it stops with one line saying what to install.
import { spawnSync } from 'node:child_process';

export const DEBIAN_PYTHON = '/usr/bin/python3';
export const DASK_PACKAGE = 'python3-distributed';
const APT_GET = '/usr/bin/apt-get';

/** Whether Debian's Python imports distributed. */
export function hasDask(python = DEBIAN_PYTHON) {
  return spawnSync(python, ['-c', 'import distributed'], { stdio: 'ignore' }).status === 0;
}

/**
 * @param {ReturnType<import('./browser.mjs').machine>} m
 * @returns {{ ok: true, installed: boolean } | { ok: false, message: string }}
 */
export function ensureDask(m, { log = console.log, check = hasDask } = {}) {
  if (check()) return { ok: true, installed: false };
  const message = `Dask test: ${DEBIAN_PYTHON} cannot import distributed; install Debian's package (as root: apt-get install ${DASK_PACKAGE})`;
  if (!(m.platform === 'linux' && m.isRoot && m.executable(APT_GET))) return { ok: false, message };
  log(`Dask test: installing Debian's ${DASK_PACKAGE} with apt-get`);
  const aptEnv = { DEBIAN_FRONTEND: 'noninteractive' };
  const done = m.run(APT_GET, ['install', '-y', '-qq', DASK_PACKAGE], aptEnv)
    || (m.run(APT_GET, ['update', '-qq'], aptEnv) && m.run(APT_GET, ['install', '-y', '-qq', DASK_PACKAGE], aptEnv));
  if (done && check()) return { ok: true, installed: true };
  return { ok: false, message: `${message}; installing it with apt-get failed` };
}
