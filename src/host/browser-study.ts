import { writeZip } from '../core/study/zip';
import type { AutosaveEntry, FileToWrite, OpenedFile, SavedStudy } from './host';

/**
 * Browser mode's study files: saving downloads the file, opening uses the file chooser, the recent
 * list keeps names in localStorage, and autosaves live in IndexedDB keyed by the input's hash.
 */

export const STUDY_EXTENSION = '.gleaner';
const RECENT_KEY = 'gleaner.recentStudies';
const RECENT_MAX = 8;
const DB_NAME = 'gleaner-autosave';
const STORE = 'autosaves';

function readRecent(): string[] {
  try {
    const value: unknown = JSON.parse(localStorage.getItem(RECENT_KEY) ?? '[]');
    return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : [];
  } catch {
    return [];
  }
}

export function rememberRecent(name: string): void {
  const list = [name, ...readRecent().filter((n) => n !== name)].slice(0, RECENT_MAX);
  localStorage.setItem(RECENT_KEY, JSON.stringify(list));
}

export async function recentStudies(): Promise<string[]> {
  return readRecent();
}

export async function saveStudyDownload(suggestedName: string, bytes: Uint8Array): Promise<SavedStudy> {
  const name = suggestedName.endsWith(STUDY_EXTENSION) ? suggestedName : `${suggestedName}${STUDY_EXTENSION}`;
  const url = URL.createObjectURL(new Blob([bytes as BlobPart], { type: 'application/zip' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.style.display = 'none';
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
  rememberRecent(name);
  return { name, location: 'your downloads folder' };
}

/** The file chooser for study files (a browser cannot reopen a recent file by name: it asks again). */
export function openStudyWithInput(): Promise<OpenedFile | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = `${STUDY_EXTENSION},.zip`;
    input.style.display = 'none';
    const done = async (file: File | null) => {
      input.remove();
      if (!file) return resolve(null);
      rememberRecent(file.name);
      resolve({ name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) });
    };
    input.addEventListener('change', () => void done(input.files?.[0] ?? null), { once: true });
    input.addEventListener('cancel', () => void done(null), { once: true });
    document.body.append(input);
    input.click();
  });
}

function openDb(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, 1);
    request.onupgradeneeded = () => request.result.createObjectStore(STORE, { keyPath: 'key' });
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error ?? new Error('the autosave store could not be opened'));
  });
}

async function withStore<T>(mode: IDBTransactionMode, use: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await openDb();
  try {
    return await new Promise<T>((resolve, reject) => {
      const tx = db.transaction(STORE, mode);
      const request = use(tx.objectStore(STORE));
      tx.oncomplete = () => resolve(request.result);
      tx.onerror = () => reject(tx.error ?? new Error('the autosave store refused the request'));
      tx.onabort = () => reject(tx.error ?? new Error('the autosave request was aborted'));
    });
  } finally {
    db.close();
  }
}

export async function writeAutosave(entry: AutosaveEntry): Promise<void> {
  await withStore('readwrite', (s) => s.put({ ...entry, bytes: entry.bytes.slice() }));
}

export async function readAutosave(key?: string): Promise<AutosaveEntry | null> {
  if (key !== undefined) return ((await withStore('readonly', (s) => s.get(key))) as AutosaveEntry | undefined) ?? null;
  const all = (await withStore('readonly', (s) => s.getAll())) as AutosaveEntry[];
  return all.reduce<AutosaveEntry | null>((best, e) => (!best || e.savedAt > best.savedAt ? e : best), null);
}

export async function clearAutosave(key: string): Promise<void> {
  await withStore('readwrite', (s) => s.delete(key));
}

/** Files downloaded one by one at most; more go as one ZIP archive (browsers drop download bursts). */
export const MAX_LOOSE_DOWNLOADS = 4;

/** Files as one ZIP archive (text as UTF-8). */
export function zipFiles(files: FileToWrite[]): Uint8Array {
  const encoder = new TextEncoder();
  return writeZip(files.map((f) => ({ name: f.name, data: typeof f.data === 'string' ? encoder.encode(f.data) : f.data })));
}
