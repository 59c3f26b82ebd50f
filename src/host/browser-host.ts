import type { FileToWrite, Host, OpenedFile, SaveOutcome } from './host';

/** Accepted extensions for windows tables, for the file pickers. */
const ACCEPT = ['.csv', '.tsv', '.txt'];

interface PickerWindow {
  showOpenFilePicker?: (options: {
    multiple?: boolean;
    excludeAcceptAllOption?: boolean;
    types?: { description: string; accept: Record<string, string[]> }[];
  }) => Promise<{ getFile(): Promise<File> }[]>;
}

async function fromFile(file: File): Promise<OpenedFile> {
  return { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) };
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
      types: [{ description: 'Windows table', accept: { 'text/csv': ['.csv'], 'text/tab-separated-values': ['.tsv', '.txt'] } }],
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
      return { name: 'windows.csv', bytes: new Uint8Array(await response.arrayBuffer()) };
    },
    async saveFiles(_suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null> {
      for (const f of files) download(f);
      return { location: 'your downloads folder', names: files.map((f) => f.name) };
    },
  };
}
