/**
 * Study files in main: Save / Save As (atomic), Open and Open Recent (main keeps the paths; the
 * renderer only ever sees names), and the autosave sidecar "<study>.autosave" (or, for a study not
 * yet saved, "<input hash>.autosave" in the app's data folder), written atomically.
 */
import { mkdir, readFile, readdir, stat, unlink } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { app, dialog, type BrowserWindow, type OpenDialogOptions, type SaveDialogOptions } from 'electron';
import { writeFileAtomic } from './atomic-write.ts';
import type { BridgeAutosave, BridgeOpenedFile, BridgeSavedStudy } from './bridge.types.ts';
import type { InputGuard } from './input-guard.ts';
import { PayloadError } from './validate.ts';
import { AUTOSAVE_SUFFIX, MAX_STUDY_BYTES, packAutosave, STUDY_EXTENSION, unpackAutosave, type StudySaveRequest } from './validate-study.ts';

const RECENT_MAX = 8;

export class StudyFiles {
  /** The study file the window works on (opened or last saved), or null. */
  #current: string | null = null;
  #recent: string[] = [];
  #loaded = false;

  constructor(private readonly guard: InputGuard) {}

  #recentFile(): string {
    return join(app.getPath('userData'), 'recent-studies.json');
  }

  #autosaveFolder(): string {
    return join(app.getPath('userData'), 'autosave');
  }

  async #loadRecent(): Promise<void> {
    if (this.#loaded) return;
    this.#loaded = true;
    const text = await readFile(this.#recentFile(), 'utf8').catch(() => '[]');
    try {
      const list: unknown = JSON.parse(text);
      this.#recent = Array.isArray(list) ? list.filter((p): p is string => typeof p === 'string') : [];
    } catch {
      this.#recent = [];
    }
  }

  async #remember(path: string): Promise<void> {
    await this.#loadRecent();
    this.#current = path;
    this.#recent = [path, ...this.#recent.filter((p) => p !== path)].slice(0, RECENT_MAX);
    await mkdir(app.getPath('userData'), { recursive: true });
    await writeFileAtomic(this.#recentFile(), JSON.stringify(this.#recent));
  }

  async recent(): Promise<string[]> {
    await this.#loadRecent();
    return this.#recent.map((p) => basename(p));
  }

  async save(win: BrowserWindow | null, request: StudySaveRequest): Promise<BridgeSavedStudy | null> {
    let target = request.saveAs ? null : this.#current;
    if (!target) {
      const options: SaveDialogOptions = {
        title: 'Save study',
        defaultPath: join(app.getPath('documents'), request.name),
        filters: [{ name: 'Gleaner study', extensions: [STUDY_EXTENSION.slice(1)] }],
      };
      const picked = win ? await dialog.showSaveDialog(win, options) : await dialog.showSaveDialog(options);
      if (picked.canceled || !picked.filePath) return null;
      target = picked.filePath.toLowerCase().endsWith(STUDY_EXTENSION) ? picked.filePath : `${picked.filePath}${STUDY_EXTENSION}`;
    }
    if (this.guard.isInput(target)) throw new PayloadError(`${basename(target)}: refusing to write over a file that was opened as input`);
    await writeFileAtomic(target, request.bytes);
    await this.#remember(target);
    return { name: basename(target), location: target };
  }

  async open(win: BrowserWindow | null, recent: string | null): Promise<BridgeOpenedFile | null> {
    await this.#loadRecent();
    let path: string | undefined;
    if (recent !== null) {
      path = this.#recent.find((p) => basename(p) === recent);
      if (!path) throw new PayloadError(`openStudy: ${recent} is not in the recent studies list`);
    } else {
      const options: OpenDialogOptions = {
        title: 'Open a study',
        properties: ['openFile'],
        filters: [{ name: 'Gleaner study', extensions: [STUDY_EXTENSION.slice(1)] }],
      };
      const picked = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
      if (picked.canceled || picked.filePaths.length === 0) return null;
      path = picked.filePaths[0];
    }
    const info = await stat(path);
    if (!info.isFile()) throw new PayloadError(`${basename(path)}: expected a study file, found a folder or device`);
    if (info.size > MAX_STUDY_BYTES) throw new PayloadError(`${basename(path)}: expected at most ${MAX_STUDY_BYTES} bytes, found ${info.size}`);
    const bytes = await readFile(path);
    await this.#remember(path);
    return { name: basename(path), bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), path };
  }

  /** Beside the current study when there is one, else in the app's data folder by input hash. */
  #autosavePath(key: string): string {
    return this.#current ? `${this.#current}${AUTOSAVE_SUFFIX}` : join(this.#autosaveFolder(), `${key}${AUTOSAVE_SUFFIX}`);
  }

  async writeAutosave(entry: BridgeAutosave): Promise<void> {
    if (!this.#current) await mkdir(this.#autosaveFolder(), { recursive: true });
    await writeFileAtomic(this.#autosavePath(entry.key), packAutosave(entry));
  }

  /** The newest autosave for `key` (or any), when it is newer than the study file it belongs to. */
  async readAutosave(key: string | null): Promise<BridgeAutosave | null> {
    const candidates: string[] = [];
    if (this.#current) candidates.push(`${this.#current}${AUTOSAVE_SUFFIX}`);
    const folder = this.#autosaveFolder();
    const names = await readdir(folder).catch(() => [] as string[]);
    for (const n of names) if (n.endsWith(AUTOSAVE_SUFFIX) && (key === null || n === `${key}${AUTOSAVE_SUFFIX}`)) candidates.push(join(folder, n));
    let best: BridgeAutosave | null = null;
    for (const path of candidates) {
      const bytes = await readFile(path).catch(() => null);
      const entry = bytes ? unpackAutosave(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength)) : null;
      if (!entry || (key !== null && entry.key !== key)) continue;
      const current = this.#current;
      if (current && path === `${current}${AUTOSAVE_SUFFIX}`) {
        const saved = await stat(current).catch(() => null);
        if (saved && saved.mtimeMs >= entry.savedAt) continue;
      }
      if (!best || entry.savedAt > best.savedAt) best = entry;
    }
    return best;
  }

  async clearAutosave(key: string): Promise<void> {
    await unlink(join(this.#autosaveFolder(), `${key}${AUTOSAVE_SUFFIX}`)).catch(() => undefined);
    if (this.#current) await unlink(`${this.#current}${AUTOSAVE_SUFFIX}`).catch(() => undefined);
  }
}
