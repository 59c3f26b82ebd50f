// Tests of the raw-folder access main gives the renderer (electron/raw-folders.ts), in Node:
// listing, reads by folder id and base name only, payload validation and size limits.
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RAW_LIMITS, RawFolders, validateRawRead } from '../../electron/raw-folders.ts';

let root: string;
let raw: string;

beforeAll(() => {
  root = mkdtempSync(join(tmpdir(), 'gleaner-raw-'));
  raw = join(root, 'raw');
  mkdirSync(join(raw, 'nested'), { recursive: true });
  writeFileSync(join(raw, 'S01.edf'), Uint8Array.from({ length: 300 }, (_, i) => i % 256));
  writeFileSync(join(raw, 'S02.csv'), 't,acc_x [g]\n0,1\n');
  writeFileSync(join(raw, 'notes.exe'), 'x');
  writeFileSync(join(raw, 'nested', 'S03.edf'), 'nested');
  writeFileSync(join(root, 'secret.csv'), 'outside');
  symlinkSync(join(root, 'secret.csv'), join(raw, 'link.csv'));
});

afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('RawFolders', () => {
  it('lists only the plain raw files at the top of the chosen folder', async () => {
    const folders = new RawFolders();
    const listed = await folders.add(raw);
    expect(listed.label).toBe('raw');
    // notes.exe: not a raw type; nested/: a folder; link.csv: a symbolic link, not a plain file.
    expect(listed.files).toEqual([{ name: 'S01.edf', size: 300 }, { name: 'S02.csv', size: 16 }]);
  });

  it('reads a byte range of a listed file, clipped to its end', async () => {
    const folders = new RawFolders();
    const { id } = await folders.add(raw);
    expect([...(await folders.read({ folderId: id, name: 'S01.edf', offset: 256, length: 4 }))]).toEqual([0, 1, 2, 3]);
    expect((await folders.read({ folderId: id, name: 'S01.edf', offset: 290, length: 100 })).length).toBe(10);
    expect((await folders.read({ folderId: id, name: 'S01.edf', offset: 1000, length: 10 })).length).toBe(0);
  });

  it('refuses files outside the listing and folders never chosen', async () => {
    const folders = new RawFolders();
    const { id } = await folders.add(raw);
    await expect(folders.read({ folderId: id, name: 'link.csv', offset: 0, length: 4 })).rejects.toThrow(/not a raw file listed/);
    await expect(folders.read({ folderId: id, name: 'secret.csv', offset: 0, length: 4 })).rejects.toThrow(/not a raw file listed/);
    await expect(folders.read({ folderId: id + 1, name: 'S01.edf', offset: 0, length: 4 })).rejects.toThrow(/was not chosen/);
  });

  it('refuses a file that was swapped for a link leading outside after listing', async () => {
    const folders = new RawFolders();
    const { id } = await folders.add(raw);
    rmSync(join(raw, 'S02.csv'));
    symlinkSync(join(root, 'secret.csv'), join(raw, 'S02.csv'));
    await expect(folders.read({ folderId: id, name: 'S02.csv', offset: 0, length: 4 })).rejects.toThrow(/outside the chosen folder/);
  });

  it('refuses a file instead of a folder', async () => {
    await expect(new RawFolders().add(join(raw, 'S01.edf'))).rejects.toThrow(/expected a folder/);
  });
});

describe('validateRawRead(args)', () => {
  it('accepts a folder id, a plain name and a bounded range', () => {
    expect(validateRawRead([1, 'S01.edf', 0, 4096])).toEqual({ folderId: 1, name: 'S01.edf', offset: 0, length: 4096 });
  });

  it.each([
    [[1, 'S01.edf', 0], /expected 4 arguments/],
    [['1', 'S01.edf', 0, 1], /positive integer id/],
    [[0, 'S01.edf', 0, 1], /positive integer id/],
    [[1, '../S01.edf', 0, 1], /plain file name/],
    [[1, 'raw/S01.edf', 0, 1], /plain file name/],
    [[1, 'C:\\S01.edf', 0, 1], /plain file name/],
    [[1, 42, 0, 1], /file name to be a string/],
    [[1, 'S01.edf', -1, 1], /offset to be a whole number/],
    [[1, 'S01.edf', 0.5, 1], /offset to be a whole number/],
    [[1, 'S01.edf', 0, RAW_LIMITS.maxReadBytes + 1], /length to be a whole number from 0/],
    [[1, 'S01.edf', 0, Number.NaN], /length/],
  ])('refuses %j', (args, message) => {
    expect(() => validateRawRead(args as unknown[])).toThrow(message);
  });
});
