/**
 * What the bridge does with files, in main: pick and read a windows table, read the demo study,
 * pick a folder and write exports atomically. Reading and writing are I/O only; parsing and every
 * computation happen in the renderer's workers.
 */
import { existsSync } from 'node:fs';
import { lstat, readFile, realpath, stat } from 'node:fs/promises';
import { homedir } from 'node:os';
import { basename, join, sep } from 'node:path';
import { app, dialog, type BrowserWindow, type OpenDialogOptions } from 'electron';
import { writeFileAtomic } from './atomic-write.ts';
import type { BridgeOpenedFile, BridgeRawFolder, BridgeSaveOutcome } from './bridge.types.ts';
import type { InputGuard } from './input-guard.ts';
import type { RawFolders } from './raw-folders.ts';
import { PayloadError, type SaveRequest } from './validate.ts';

/** Largest windows table read through the bridge (bytes). */
export const MAX_INPUT_BYTES = 2 * 1024 * 1024 * 1024 - 1;

async function readInput(path: string, guard: InputGuard): Promise<BridgeOpenedFile> {
  const real = await realpath(path);
  const info = await stat(real);
  if (!info.isFile()) throw new PayloadError(`${basename(path)}: expected a file, found a folder or device`);
  if (info.size > MAX_INPUT_BYTES) {
    throw new PayloadError(`${basename(path)}: expected at most ${MAX_INPUT_BYTES} bytes, found ${info.size}`);
  }
  guard.remember(real);
  if (real !== path) guard.remember(path);
  const bytes = await readFile(real);
  return { name: basename(path), bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), path };
}

export async function openWindowsFile(win: BrowserWindow | null, guard: InputGuard): Promise<BridgeOpenedFile | null> {
  const options: OpenDialogOptions = {
    title: 'Open a windows table',
    properties: ['openFile'],
    filters: [
      { name: 'Windows tables', extensions: ['csv', 'tsv', 'txt', 'parquet', 'arrow', 'feather'] },
      { name: 'All files', extensions: ['*'] },
    ],
  };
  const picked = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
  if (picked.canceled || picked.filePaths.length === 0) return null;
  return readInput(picked.filePaths[0], guard);
}

/** The demo study's windows table, shipped inside the app (read here, never fetched). */
export async function loadDemo(guard: InputGuard): Promise<BridgeOpenedFile> {
  const path = join(app.getAppPath(), 'demo-data', 'windows.csv');
  if (!existsSync(path)) {
    throw new PayloadError(`demo-data/windows.csv: expected the demo study next to the app, found nothing (run npm run demo-data)`);
  }
  return readInput(path, guard);
}

function friendly(folder: string): string {
  const home = homedir();
  return folder === home || folder.startsWith(home + sep) ? `~${folder.slice(home.length)}` : folder;
}

/**
 * Lets the user pick a folder, then writes every file there atomically. Refuses (before writing
 * anything) when a target is a file that was opened as input or is not a regular file; asks
 * before replacing existing files. Null when the user cancels.
 */
export async function saveFiles(win: BrowserWindow | null, guard: InputGuard, request: SaveRequest): Promise<BridgeSaveOutcome | null> {
  const start = request.suggestedFolder === '' ? app.getPath('documents') : join(app.getPath('documents'), request.suggestedFolder);
  const options: OpenDialogOptions = {
    title: `Choose a folder for ${request.files.length === 1 ? request.files[0].name : `${request.files.length} files`}`,
    buttonLabel: 'Export here',
    defaultPath: existsSync(start) ? start : app.getPath('documents'),
    properties: ['openDirectory', 'createDirectory', 'promptToCreate'],
  };
  const picked = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
  if (picked.canceled || picked.filePaths.length === 0) return null;
  const folder = await realpath(picked.filePaths[0]);

  const existing: string[] = [];
  for (const file of request.files) {
    const target = join(folder, file.name);
    const info = await lstat(target).catch(() => null);
    if (!info) continue;
    const real = await realpath(target).catch(() => target);
    if (guard.isInput(target) || guard.isInput(real)) {
      throw new PayloadError(`${file.name}: refusing to write over a file that was opened as input; choose another folder`);
    }
    if (!info.isFile() && !info.isSymbolicLink()) {
      throw new PayloadError(`${file.name}: expected a file name free in ${friendly(folder)}, found a folder or device there`);
    }
    existing.push(file.name);
  }
  if (existing.length > 0) {
    const confirm = {
      type: 'question' as const,
      buttons: ['Replace', 'Cancel'],
      defaultId: 1,
      cancelId: 1,
      message: `Replace ${existing.length === 1 ? existing[0] : `${existing.length} existing files`} in ${friendly(folder)}?`,
      detail: existing.join('\n'),
    };
    const answer = win ? await dialog.showMessageBox(win, confirm) : await dialog.showMessageBox(confirm);
    if (answer.response !== 0) return null;
  }
  for (const file of request.files) await writeFileAtomic(join(folder, file.name), file.data);
  return { location: friendly(folder), names: request.files.map((f) => f.name) };
}

/** Asks for a folder of raw-signal files and remembers it; null when the user cancels. */
export async function chooseRawFolder(win: BrowserWindow | null, folders: RawFolders): Promise<BridgeRawFolder | null> {
  const options: OpenDialogOptions = {
    title: 'Choose the folder of raw-signal files (EDF or CSV)',
    buttonLabel: 'Use this folder',
    properties: ['openDirectory'],
  };
  const picked = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
  if (picked.canceled || picked.filePaths.length === 0) return null;
  return folders.add(picked.filePaths[0]);
}

/** The demo study's raw signals next to the app (demo-data/raw), or null when they were not generated. */
export async function demoRawFolder(folders: RawFolders): Promise<BridgeRawFolder | null> {
  const path = join(app.getAppPath(), 'demo-data', 'raw');
  return existsSync(path) ? folders.add(path) : null;
}
