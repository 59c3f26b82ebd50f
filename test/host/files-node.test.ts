// Tests of main's Node-only file helpers: the input guard and atomic writes (no electron import).
import { mkdtempSync, readdirSync, readFileSync, rmSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../electron/atomic-write.ts';
import { InputGuard } from '../../electron/input-guard.ts';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'gleaner-host-'));
});
afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe('InputGuard', () => {
  it('knows opened inputs after resolving the path, and nothing else', () => {
    const guard = new InputGuard('linux');
    guard.remember('/data/study/windows.csv');
    expect(guard.isInput('/data/study/windows.csv')).toBe(true);
    expect(guard.isInput('/data/study/../study/./windows.csv')).toBe(true);
    expect(guard.isInput('/data/study/labels.csv')).toBe(false);
    // Linux file systems are case-sensitive (common practice): another case is another file.
    expect(guard.isInput('/data/study/Windows.csv')).toBe(false);
    expect(guard.firstInput(['/data/study/labels.csv', '/data/study/windows.csv'])).toBe('/data/study/windows.csv');
    expect(guard.firstInput(['/data/study/labels.csv'])).toBeNull();
  });

  it('ignores case on Windows and macOS, whose default file systems do (common practice)', () => {
    for (const platform of ['win32', 'darwin']) {
      const guard = new InputGuard(platform);
      guard.remember('/data/Study/windows.csv');
      expect(guard.isInput('/DATA/study/WINDOWS.CSV'), platform).toBe(true);
    }
  });
});

describe('writeFileAtomic(target, data)', () => {
  it('writes text as UTF-8 and bytes as given, leaving no temporary file', async () => {
    await writeFileAtomic(join(dir, 'labels.csv'), 'window_id,class\nw1,Müller\n');
    await writeFileAtomic(join(dir, 'figure.png'), new Uint8Array([0x89, 0x50, 0x4e, 0x47]));
    expect(readFileSync(join(dir, 'labels.csv'), 'utf8')).toBe('window_id,class\nw1,Müller\n');
    expect([...readFileSync(join(dir, 'figure.png'))]).toEqual([0x89, 0x50, 0x4e, 0x47]);
    expect(readdirSync(dir).sort()).toEqual(['figure.png', 'labels.csv']);
  });

  it('replaces an existing file whole', async () => {
    const target = join(dir, 'labels.csv');
    writeFileSync(target, 'old content that is longer than the new one\n');
    await writeFileAtomic(target, 'new\n');
    expect(readFileSync(target, 'utf8')).toBe('new\n');
    expect(readdirSync(dir)).toEqual(['labels.csv']);
  });

  it('leaves what was there and no temporary file when the final rename fails', async () => {
    // Renaming a file over a non-empty folder fails on every platform (POSIX rename(2), from memory).
    const target = join(dir, 'labels.csv');
    mkdirSync(target);
    writeFileSync(join(target, 'keep.txt'), 'keep');
    await expect(writeFileAtomic(target, 'new\n')).rejects.toThrow();
    expect(readdirSync(dir)).toEqual(['labels.csv']);
    expect(readFileSync(join(target, 'keep.txt'), 'utf8')).toBe('keep');
  });

  it('fails when the folder does not exist', async () => {
    await expect(writeFileAtomic(join(dir, 'missing', 'labels.csv'), 'x')).rejects.toThrow(/ENOENT/);
  });
});
