/**
 * Raw-signal folders the user chose (or the demo's), remembered in main. The renderer may read
 * byte ranges of the plain files listed in such a folder, by folder id and base name only: it
 * never sends a path, so it cannot reach outside the folders the user picked. Node only (no
 * electron import), so test/host/raw-folders.test.ts checks it in Node.
 */
import { open, readdir, realpath, stat } from 'node:fs/promises';
import { basename, join, sep } from 'node:path';
import type { BridgeRawFolder } from './bridge.types.ts';
import { extensionOf, PayloadError, plainNameProblem } from './validate.ts';

/** File types listed in a raw folder: EDF/EDF+ recordings, raw CSV/TSV tables, manifests. */
export const RAW_EXTENSIONS = ['.edf', '.csv', '.tsv', '.txt'] as const;

export const RAW_LIMITS = {
  /** Bytes in one read request (readers ask for spans of a few records). */
  maxReadBytes: 16 * 1024 * 1024,
  /** Files listed per folder. */
  maxFiles: 10_000,
  /** Folders remembered at once (the oldest is forgotten first). */
  maxFolders: 16,
} as const;

export interface RawReadRequest {
  folderId: number;
  name: string;
  offset: number;
  length: number;
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  return typeof value === 'string' ? JSON.stringify(value.length > 40 ? `${value.slice(0, 37)}...` : value) : typeof value === 'number' ? String(value) : typeof value;
}

/** Checks the arguments of readRaw(folderId, name, offset, length); throws a PayloadError saying what was expected. */
export function validateRawRead(args: readonly unknown[]): RawReadRequest {
  if (args.length !== 4) throw new PayloadError(`readRaw: expected 4 arguments (folder, name, offset, length), found ${args.length}`);
  const [folderId, name, offset, length] = args;
  if (typeof folderId !== 'number' || !Number.isSafeInteger(folderId) || folderId < 1) {
    throw new PayloadError(`readRaw: expected the folder to be a positive integer id, found ${describe(folderId)}`);
  }
  if (typeof name !== 'string') throw new PayloadError(`readRaw: expected the file name to be a string, found ${describe(name)}`);
  const problem = plainNameProblem(name);
  if (problem) throw new PayloadError(`readRaw: the file name ${JSON.stringify(name)} ${problem}; expected a plain file name`);
  if (typeof offset !== 'number' || !Number.isSafeInteger(offset) || offset < 0) {
    throw new PayloadError(`readRaw ${name}: expected the offset to be a whole number ≥ 0, found ${describe(offset)}`);
  }
  if (typeof length !== 'number' || !Number.isSafeInteger(length) || length < 0 || length > RAW_LIMITS.maxReadBytes) {
    throw new PayloadError(`readRaw ${name}: expected the length to be a whole number from 0 to ${RAW_LIMITS.maxReadBytes}, found ${describe(length)}`);
  }
  return { folderId, name, offset, length };
}

interface Folder {
  real: string;
  files: Map<string, number>;
}

export class RawFolders {
  readonly #folders = new Map<number, Folder>();
  #next = 1;

  /** Lists a folder's plain raw files (no sub-folders, no links leaving it) and remembers it. */
  async add(path: string): Promise<BridgeRawFolder> {
    const real = await realpath(path);
    if (!(await stat(real)).isDirectory()) throw new PayloadError(`${basename(path)}: expected a folder of raw-signal files, found a file`);
    const files = new Map<string, number>();
    for (const entry of await readdir(real, { withFileTypes: true })) {
      if (files.size >= RAW_LIMITS.maxFiles) break;
      if (!entry.isFile() || plainNameProblem(entry.name) !== null) continue;
      if (!(RAW_EXTENSIONS as readonly string[]).includes(extensionOf(entry.name))) continue;
      files.set(entry.name, (await stat(join(real, entry.name))).size);
    }
    const id = this.#next++;
    this.#folders.set(id, { real, files });
    while (this.#folders.size > RAW_LIMITS.maxFolders) this.#folders.delete(this.#folders.keys().next().value!);
    return { id, label: basename(real), files: [...files].map(([name, size]) => ({ name, size })).sort((a, b) => a.name.localeCompare(b.name)) };
  }

  /** Bytes [offset, offset + length) of a listed file, clipped to its end. */
  async read(request: RawReadRequest): Promise<Uint8Array> {
    const folder = this.#folders.get(request.folderId);
    if (!folder) throw new PayloadError(`readRaw: folder ${request.folderId} was not chosen in this session; choose the raw folder again`);
    if (!folder.files.has(request.name)) throw new PayloadError(`readRaw: ${request.name} is not a raw file listed in the chosen folder`);
    const path = join(folder.real, request.name);
    const real = await realpath(path);
    if (!real.startsWith(folder.real + sep)) throw new PayloadError(`readRaw: ${request.name} leads outside the chosen folder`);
    const handle = await open(real, 'r');
    try {
      const { size } = await handle.stat();
      const n = Math.max(0, Math.min(request.length, size - request.offset));
      const out = new Uint8Array(n);
      let got = 0;
      while (got < n) {
        const { bytesRead } = await handle.read(out, got, n - got, request.offset + got);
        if (bytesRead === 0) break;
        got += bytesRead;
      }
      return got === n ? out : out.subarray(0, got);
    } finally {
      await handle.close();
    }
  }
}
