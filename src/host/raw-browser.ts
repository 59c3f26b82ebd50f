import { blobSource } from '../core/raw/byte-source';
import type { RawFolder } from './raw-folder';
import { baseName } from './raw-folder';

/** A raw folder over files the user picked (a directory's top-level files, keyed by base name). */
export function filesRawFolder(label: string, files: Iterable<File>): RawFolder {
  const byName = new Map<string, File>();
  for (const f of files) if (!byName.has(f.name)) byName.set(f.name, f);
  return {
    label,
    names: [...byName.keys()].sort(),
    open: (name) => {
      const f = byName.get(baseName(name));
      return Promise.resolve(f ? blobSource(f) : null);
    },
  };
}

interface DirectoryHandle {
  name: string;
  values(): AsyncIterable<{ kind: 'file' | 'directory'; name: string; getFile?: () => Promise<File> }>;
}
type DirectoryPicker = (options?: { mode?: 'read' }) => Promise<DirectoryHandle>;

/** The File System Access directory picker; null when cancelled. */
async function pickDirectory(picker: DirectoryPicker): Promise<RawFolder | null> {
  let dir: DirectoryHandle;
  try {
    dir = await picker({ mode: 'read' });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') return null;
    throw err;
  }
  const files: File[] = [];
  for await (const entry of dir.values()) if (entry.kind === 'file' && entry.getFile) files.push(await entry.getFile());
  return filesRawFolder(dir.name, files);
}

/** A hidden <input webkitdirectory> (every browser with folder upload); null when cancelled. */
function pickWithInput(): Promise<RawFolder | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.webkitdirectory = true;
    input.multiple = true;
    input.style.display = 'none';
    const done = (folder: RawFolder | null) => {
      input.remove();
      resolve(folder);
    };
    input.addEventListener('change', () => {
      const list = [...(input.files ?? [])];
      // Only the chosen folder's own files, as in Electron (no sub-folders).
      const top = list.filter((f) => f.webkitRelativePath.split('/').length <= 2);
      const label = list[0]?.webkitRelativePath.split('/')[0] || 'chosen folder';
      done(list.length === 0 ? null : filesRawFolder(label, top.length > 0 ? top : list));
    }, { once: true });
    input.addEventListener('cancel', () => done(null), { once: true });
    document.body.append(input);
    input.click();
  });
}

/** Asks for a raw folder: the directory picker where the browser has one (and it is preferred), else folder upload. */
export function chooseBrowserRawFolder(preferPicker: boolean): Promise<RawFolder | null> {
  const picker = (window as unknown as { showDirectoryPicker?: DirectoryPicker }).showDirectoryPicker;
  return preferPicker && picker ? pickDirectory(picker.bind(window)) : pickWithInput();
}
