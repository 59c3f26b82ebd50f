import { describe, expect, it } from 'vitest';
// @ts-expect-error plain JavaScript module without type declarations
import { ensureDask } from '../../scripts/dask.mjs';

const quiet = () => undefined;
function fakeMachine(over: Partial<{ platform: string; isRoot: boolean; apt: boolean; installs: boolean }> = {}) {
  const calls: string[][] = [];
  let installed = false;
  return {
    calls,
    check: () => installed,
    m: {
      env: {}, platform: over.platform ?? 'linux', isRoot: over.isRoot ?? true,
      executable: () => over.apt ?? true,
      run: (cmd: string, args: string[]) => { calls.push([cmd, ...args]); if (args[0] === 'install' && (over.installs ?? true)) installed = true; return true; },
    },
  };
}

describe('ensureDask (npm test makes sure the Dask test can run)', () => {
  it('installs Debian\'s python3-distributed as root when it is missing', () => {
    const f = fakeMachine();
    expect(ensureDask(f.m, { log: quiet, check: f.check })).toEqual({ ok: true, installed: true });
    expect(f.calls[0]).toEqual(['/usr/bin/apt-get', 'install', '-y', '-qq', 'python3-distributed']);
  });

  it('stops with one line saying what to install when it cannot', () => {
    const f = fakeMachine({ isRoot: false });
    const r = ensureDask(f.m, { log: quiet, check: f.check });
    expect(r.ok).toBe(false);
    expect(r.message).toBe("Dask test: /usr/bin/python3 cannot import distributed; install Debian's package (as root: apt-get install python3-distributed)");
    expect(f.calls).toEqual([]);
  });

  it('does nothing when the package is there', () => {
    const f = fakeMachine();
    expect(ensureDask(f.m, { log: quiet, check: () => true })).toEqual({ ok: true, installed: false });
    expect(f.calls).toEqual([]);
  });
});
