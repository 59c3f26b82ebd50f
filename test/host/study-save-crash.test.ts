// Crash safety of saving a study (the desktop app's save path, electron/atomic-write.ts, run in
// Node): the saving process is killed with SIGKILL mid-write. The earlier study stays whole and
// opens; no half file is left under the study's name; the next save removes the stale temporary
// file. Autosave lookups only read names ending in ".autosave", so a stale temporary file is
// never taken for one.
import { spawn } from 'node:child_process';
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../electron/atomic-write.ts';
import { decodeStudy } from '../../src/core/study/decode';
import { encodeStudy } from '../../src/core/study/encode';
import { smallStudy } from '../core/study/fixture';
import { tempDir } from '../temp';

const ROOT = join(import.meta.dirname, '../..');
const NOTE_BYTES = 400_000;

describe('a study save killed mid-write', () => {
  it('keeps the earlier study whole under its name, and the next save removes the temporary file', { timeout: 120_000 }, async () => {
    const dir = tempDir('study-crash');
    const target = join(dir, 'home routines.gleaner');
    const earlier = encodeStudy({ ...smallStudy(), notes: 'first save' });
    await writeFileAtomic(target, earlier);

    const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'test/host/save-study-child.ts'), target, String(NOTE_BYTES)], { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] });
    let said = '';
    child.stdout.on('data', (c) => (said += String(c)));
    const exited = new Promise<NodeJS.Signals | null>((resolve) => child.on('exit', (_code, signal) => resolve(signal)));
    const prefix = `.home routines.gleaner.${child.pid}-`;
    const deadline = Date.now() + 60_000;
    let temp: string | undefined;
    try {
      while (!(temp = readdirSync(dir).find((n) => n.startsWith(prefix) && n.endsWith('.tmp')))) {
        if (child.exitCode !== null || Date.now() > deadline) throw new Error('the saving process never made its temporary file');
        await new Promise((r) => setTimeout(r, 5));
      }
    } finally {
      child.kill('SIGKILL');
    }
    expect(await exited).toBe('SIGKILL');
    expect(said).toBe('');

    // The earlier study is there, whole, and opens; the temporary file holds less than a study.
    expect(readFileSync(target).equals(Buffer.from(earlier))).toBe(true);
    expect(decodeStudy(new Uint8Array(readFileSync(target)), 'home routines.gleaner').notes).toBe('first save');
    expect(statSync(join(dir, temp)).size).toBeLessThan(NOTE_BYTES);
    expect(readdirSync(dir).sort()).toEqual([temp, 'home routines.gleaner'].sort());

    // The next save replaces the study and removes the dead process's temporary file.
    await writeFileAtomic(target, encodeStudy({ ...smallStudy(), notes: 'third save' }));
    expect(decodeStudy(new Uint8Array(readFileSync(target)), 'x.gleaner').notes).toBe('third save');
    expect(readdirSync(dir)).toEqual(['home routines.gleaner']);
  });

  it("keeps another running process's temporary file (it may still be writing)", async () => {
    const dir = tempDir('study-live');
    const target = join(dir, 'a.gleaner');
    // process.ppid is alive: the runner that started this test.
    const live = `.a.gleaner.${process.ppid}-0123456789ab.tmp`;
    writeFileSync(join(dir, live), 'half');
    await writeFileAtomic(target, 'whole');
    expect(readdirSync(dir).sort()).toEqual([live, 'a.gleaner'].sort());
  });
});
