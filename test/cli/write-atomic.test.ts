import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../src/cli/write-atomic';
import { tempDir } from '../temp';

describe('writeFileAtomic (CLI outputs)', () => {
  it('writes text and bytes, replaces an existing file whole and leaves no temporary file', () => {
    const dir = tempDir('atomic');
    const path = join(dir, 'summary.json');
    writeFileSync(path, 'old contents that are longer than the new ones');
    writeFileAtomic(path, '{"a":1}\n');
    expect(readFileSync(path, 'utf8')).toBe('{"a":1}\n');
    writeFileAtomic(path, Uint8Array.of(0xe2, 0x80, 0x94));
    expect(readFileSync(path, 'utf8')).toBe('\u2014');
    // A temporary file left by an interrupted run of the same process id is replaced, not an error.
    writeFileSync(join(dir, `.summary.json.${process.pid}.tmp`), 'half');
    writeFileAtomic(path, 'new');
    expect(readFileSync(path, 'utf8')).toBe('new');
    expect(readdirSync(dir)).toEqual(['summary.json']);
  });

  it("removes the temporary files of runs whose process is gone, and keeps a running process's", () => {
    const dir = tempDir('atomic');
    const gone = spawnSync(process.execPath, ['-e', '']).pid; // has exited
    writeFileSync(join(dir, `.windows.csv.${gone}.tmp`), 'half of an earlier run');
    writeFileSync(join(dir, `.windows.csv.${process.ppid}.tmp`), 'another run, still going');
    writeFileSync(join(dir, `.summary.json.${gone}.tmp`), 'another output: left for its own next write');
    writeFileAtomic(join(dir, 'windows.csv'), 'id\n');
    expect(readdirSync(dir).sort()).toEqual([`.summary.json.${gone}.tmp`, `.windows.csv.${process.ppid}.tmp`, 'windows.csv']);
  });

  it('fails with the reason when the folder does not exist, and writes nothing', () => {
    const dir = tempDir('atomic');
    expect(() => writeFileAtomic(join(dir, 'missing', 'out.csv'), 'x')).toThrow(/ENOENT/);
    expect(readdirSync(dir)).toEqual([]);
  });
});
