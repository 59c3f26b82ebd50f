// scripts/browser.mjs: how `npm test` makes sure the browser tests have their Chromium, checked on
// imagined machines (nothing is installed or run here).
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

type Result = { ok: true; path: string; installed: boolean } | { ok: false; message: string; plan?: string[] };
interface Machine {
  env: Record<string, string | undefined>;
  platform: string;
  isRoot: boolean;
  executable: (path: string) => boolean;
  run: (cmd: string, args: string[], env: Record<string, string>) => boolean;
}
const ROOT = resolve(import.meta.dirname, '../..');
const mod = (await import(pathToFileURL(join(ROOT, 'scripts/browser.mjs')).href)) as {
  ensureBrowser: (m: Machine, o?: { dryRun?: boolean; log?: (line: string) => void }) => Result;
  chromiumPath: (env: Record<string, string | undefined>) => string;
};

/** A machine with the given executables; `installs` lists what a successful apt-get adds. */
function fake(options: { files?: string[]; isRoot?: boolean; platform?: string; env?: Record<string, string>; installs?: string[]; aptFails?: boolean }) {
  const files = new Set(options.files ?? []);
  const ran: string[] = [];
  const m: Machine = {
    env: options.env ?? {},
    platform: options.platform ?? 'linux',
    isRoot: options.isRoot ?? true,
    executable: (p) => files.has(p),
    run: (cmd, args, env) => {
      ran.push(`${env.DEBIAN_FRONTEND === 'noninteractive' ? 'DEBIAN_FRONTEND=noninteractive ' : ''}${cmd} ${args.join(' ')}`);
      if (options.aptFails) return false;
      if (args[0] === 'install') for (const f of options.installs ?? []) files.add(f);
      return true;
    },
  };
  return { m, ran };
}
const quiet = { log: () => {} };

describe('ensureBrowser (scripts/browser.mjs)', () => {
  it('uses /usr/bin/chromium, or the executable GLEANER_CHROMIUM names', () => {
    expect(mod.chromiumPath({})).toBe('/usr/bin/chromium');
    expect(mod.chromiumPath({ GLEANER_CHROMIUM: '/opt/chromium/chrome' })).toBe('/opt/chromium/chrome');
    const { m, ran } = fake({ files: ['/usr/bin/chromium'] });
    expect(mod.ensureBrowser(m, quiet)).toEqual({ ok: true, path: '/usr/bin/chromium', installed: false });
    expect(ran).toEqual([]);
  });

  it("installs Debian's chromium with apt-get when it is missing, as root with apt-get", () => {
    const { m, ran } = fake({ files: ['/usr/bin/apt-get'], installs: ['/usr/bin/chromium'] });
    const lines: string[] = [];
    expect(mod.ensureBrowser(m, { log: (l) => lines.push(l) })).toEqual({ ok: true, path: '/usr/bin/chromium', installed: true });
    expect(ran).toEqual([
      'DEBIAN_FRONTEND=noninteractive /usr/bin/apt-get update -qq',
      'DEBIAN_FRONTEND=noninteractive /usr/bin/apt-get install -y -qq chromium fonts-dejavu-core',
    ]);
    expect(lines).toEqual(["browser tests: no Chromium at /usr/bin/chromium; installing Debian's chromium fonts-dejavu-core with apt-get"]);
  });

  it('only says what it would run in a dry run', () => {
    const { m, ran } = fake({ files: ['/usr/bin/apt-get'] });
    const r = mod.ensureBrowser(m, { dryRun: true, ...quiet });
    expect(r.ok).toBe(false);
    expect(r.ok === false && r.plan).toEqual(['/usr/bin/apt-get update', '/usr/bin/apt-get install -y chromium fonts-dejavu-core']);
    expect(ran).toEqual([]);
  });

  it('stops with one line saying what to install when it cannot install (not root, no apt-get, not Linux, or apt-get failed)', () => {
    const oneLine = /^browser tests: [^\n]*apt-get install chromium fonts-dejavu-core[^\n]*GLEANER_CHROMIUM[^\n]*$/;
    for (const machine of [fake({ isRoot: false, files: ['/usr/bin/apt-get'] }), fake({ files: [] }), fake({ platform: 'darwin', files: ['/usr/bin/apt-get'] })]) {
      const r = mod.ensureBrowser(machine.m, quiet);
      expect(r.ok).toBe(false);
      expect(r.ok === false && r.message).toMatch(oneLine);
      expect(machine.ran).toEqual([]);
    }
    const failing = fake({ files: ['/usr/bin/apt-get'], aptFails: true });
    const r = mod.ensureBrowser(failing.m, quiet);
    expect(r.ok === false && r.message).toMatch(/^browser tests: installing chromium fonts-dejavu-core with apt-get failed; [^\n]*apt-get install chromium/);
  });

  it('never installs over a GLEANER_CHROMIUM that is missing: it names the variable', () => {
    const { m, ran } = fake({ files: ['/usr/bin/apt-get', '/usr/bin/chromium'], env: { GLEANER_CHROMIUM: '/opt/none/chrome' } });
    const r = mod.ensureBrowser(m, quiet);
    expect(r.ok === false && r.message).toBe('browser tests: GLEANER_CHROMIUM=/opt/none/chrome is not an executable; point it at a Chromium executable, or unset it to use /usr/bin/chromium');
    expect(ran).toEqual([]);
  });

  it('as a command: prints the one line and exits 1 when the named browser is missing', () => {
    const r = spawnSync(process.execPath, [join(ROOT, 'scripts/browser.mjs'), '--dry-run'], { encoding: 'utf8', env: { ...process.env, GLEANER_CHROMIUM: join(ROOT, 'no-such-chromium') } });
    expect(r.status).toBe(1);
    expect(r.stdout.trim().split('\n')).toHaveLength(1);
    expect(r.stdout).toContain('GLEANER_CHROMIUM=');
  });
});
