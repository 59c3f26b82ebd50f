import * as study from './browser-study';
import { MAX_LOOSE_DOWNLOADS, zipFiles } from './browser-study';
import { chooseBrowserRawFolder } from './raw-browser';
import { httpRawFolder } from './raw-http';
import type { FileToWrite, Host, SaveOutcome, StreamedFile } from './host';

/** Accepted extensions for windows tables, for the file pickers: text, Parquet and Arrow IPC. */
const ACCEPT = ['.csv', '.tsv', '.txt', '.parquet', '.arrow', '.feather', '.ipc'];

interface PickerWindow {
  showOpenFilePicker?: (options: {
    multiple?: boolean;
    excludeAcceptAllOption?: boolean;
    types?: { description: string; accept: Record<string, string[]> }[];
  }) => Promise<{ getFile(): Promise<File> }[]>;
}

/** The picked file as it is: the worker reads it in slices, the page never reads it whole. */
function fromFile(file: File): StreamedFile {
  return { name: file.name, blob: file };
}

/** Opens the browser's file chooser through a hidden <input type=file>; null when cancelled. */
function pickWithInput(): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = ACCEPT.join(',');
    input.style.display = 'none';
    const done = (file: File | null) => {
      input.remove();
      resolve(file);
    };
    input.addEventListener('change', () => done(input.files?.[0] ?? null), { once: true });
    input.addEventListener('cancel', () => done(null), { once: true });
    document.body.append(input);
    input.click();
  });
}

/** The File System Access picker where the browser has one; null when cancelled. */
async function pickWithPicker(picker: NonNullable<PickerWindow['showOpenFilePicker']>): Promise<File | null> {
  try {
    const [handle] = await picker({
      multiple: false,
      types: [{ description: 'Windows table', accept: { 'text/csv': ['.csv'], 'text/tab-separated-values': ['.tsv', '.txt'], 'application/octet-stream': ['.parquet', '.arrow', '.feather', '.ipc'] } }],
    });
    return handle ? await handle.getFile() : null;
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') return null;
    throw err;
  }
}

/** Offers a file as a download (the browser puts it in the user's downloads folder). */
function download(file: FileToWrite): void {
  const blob = new Blob([file.data as BlobPart], { type: file.name.endsWith('.json') ? 'application/json' : 'text/csv' });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = file.name;
  a.style.display = 'none';
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

export interface BrowserHostOptions {
  /**
   * Use the File System Access picker (showOpenFilePicker) when the browser has one. Off by
   * default: the hidden file input opens the same native dialog, works in every browser, and is
   * the chooser that automation (the end-to-end tests) can answer; Chromium aborts the picker
   * when a test intercepts file choosers.
   */
  preferPicker?: boolean;
}

/** Browser mode: file pickers, the demo table from the server next to the page, downloads. */
export function browserHost(options: BrowserHostOptions = {}): Host {
  const preferPicker = options.preferPicker ?? false;
  return {
    kind: 'browser',
    async openWindowsFile() {
      const picker = (window as unknown as PickerWindow).showOpenFilePicker;
      const file = preferPicker && picker ? await pickWithPicker(picker.bind(window)) : await pickWithInput();
      return file ? fromFile(file) : null;
    },
    async loadDemo() {
      const url = new URL('demo/windows.csv', document.baseURI);
      const response = await fetch(url);
      if (!response.ok) throw new Error(`the demo study could not be read from ${url.pathname} (HTTP ${response.status})`);
      return { name: 'windows.csv', blob: await response.blob() };
    },
    async saveFiles(suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null> {
      // Browsers drop rapid bursts of downloads: many files travel as one ZIP "folder".
      if (files.length > MAX_LOOSE_DOWNLOADS) {
        const name = `${suggestedFolder || 'gleaner'}-export.zip`;
        download({ name, data: zipFiles(files) });
        return { location: `your downloads folder (${name})`, names: files.map((f) => f.name) };
      }
      for (const f of files) download(f);
      return { location: 'your downloads folder', names: files.map((f) => f.name) };
    },
    saveStudy: (suggestedName, bytes) => study.saveStudyDownload(suggestedName, bytes),
    openStudy: () => study.openStudyWithInput(),
    recentStudies: () => study.recentStudies(),
    writeAutosave: (entry) => study.writeAutosave(entry),
    readAutosave: (key) => study.readAutosave(key),
    clearAutosave: (key) => study.clearAutosave(key),
    chooseRawFolder: () => chooseBrowserRawFolder(preferPicker),
    demoRawFolder: () => Promise.resolve(httpRawFolder(new URL('demo/raw/', document.baseURI), "the demo's raw signals")),
  };
}
