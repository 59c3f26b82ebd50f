// Tests of the Electron adapter (src/host/electron-host.ts) over a fake bridge, and of the channel list.
import { describe, expect, it } from 'vitest';
import type { PreloadApi } from '../../electron/bridge.types.ts';
import { INVOKE_CHANNELS, isMenuCommand, MENU_CHANNEL, MENU_COMMANDS } from '../../electron/channels.ts';
import { electronHost, unwrapRemoteError } from '../../src/host/electron-host.ts';
import type { ElectronBridge, FileToWrite, MenuCommand } from '../../src/host/host.ts';

// Compile-time: the preload's API and the renderer's bridge type are the same shape both ways
// (tsc -p tsconfig.json fails here if they drift).
const _preloadIsBridge = (api: PreloadApi): ElectronBridge => api;
const _bridgeIsPreload = (bridge: ElectronBridge): PreloadApi => bridge;
void _preloadIsBridge;
void _bridgeIsPreload;

function fakeBridge(overrides: Partial<ElectronBridge> = {}) {
  const calls: { method: string; args: unknown[] }[] = [];
  const listeners: ((c: MenuCommand) => void)[] = [];
  const bridge: ElectronBridge = {
    openWindowsFile: async () => {
      calls.push({ method: 'openWindowsFile', args: [] });
      return { name: 'windows.csv', bytes: new Uint8Array([0x61]), path: '/data/windows.csv' };
    },
    loadDemo: async () => {
      calls.push({ method: 'loadDemo', args: [] });
      return { name: 'windows.csv', bytes: new Uint8Array([0x62]) };
    },
    saveFiles: async (folder: string, files: FileToWrite[]) => {
      calls.push({ method: 'saveFiles', args: [folder, files] });
      return { location: '~/labels', names: files.map((f) => f.name) };
    },
    onMenuCommand: (listener) => {
      listeners.push(listener);
      return () => listeners.splice(listeners.indexOf(listener), 1);
    },
    saveStudy: async (name: string, bytes: Uint8Array, saveAs: boolean) => {
      calls.push({ method: 'saveStudy', args: [name, bytes, saveAs] });
      return { name, location: `/studies/${name}` };
    },
    openStudy: async (recent: string | null) => {
      calls.push({ method: 'openStudy', args: [recent] });
      return null;
    },
    recentStudies: async () => ['a.gleaner'],
    writeAutosave: async (entry) => {
      calls.push({ method: 'writeAutosave', args: [entry] });
    },
    readAutosave: async (key: string | null) => {
      calls.push({ method: 'readAutosave', args: [key] });
      return null;
    },
    clearAutosave: async (key: string) => {
      calls.push({ method: 'clearAutosave', args: [key] });
    },
    chooseRawFolder: async () => {
      calls.push({ method: 'chooseRawFolder', args: [] });
      return { id: 3, label: 'raw', files: [{ name: 'S01.edf', size: 10 }] };
    },
    demoRawFolder: async () => null,
    readRaw: async (folderId: number, name: string, offset: number, length: number) => {
      calls.push({ method: 'readRaw', args: [folderId, name, offset, length] });
      return Uint8Array.from({ length }, (_, i) => offset + i);
    },
    ...overrides,
  };
  return { bridge, calls, listeners };
}

describe('electronHost(bridge)', () => {
  it('passes each call through to the bridge and returns its answer', async () => {
    const { bridge, calls } = fakeBridge();
    const host = electronHost(bridge);
    expect(host.kind).toBe('electron');
    expect((await host.openWindowsFile())?.path).toBe('/data/windows.csv');
    expect([...(await host.loadDemo()).bytes]).toEqual([0x62]);
    const files = [{ name: 'labels.csv', data: 'a\n' }];
    expect(await host.saveFiles('labels', files)).toEqual({ location: '~/labels', names: ['labels.csv'] });
    expect(calls).toEqual([
      { method: 'openWindowsFile', args: [] },
      { method: 'loadDemo', args: [] },
      { method: 'saveFiles', args: ['labels', files] },
    ]);
  });

  it('returns null when the user cancels', async () => {
    const { bridge } = fakeBridge({ openWindowsFile: async () => null, saveFiles: async () => null });
    const host = electronHost(bridge);
    expect(await host.openWindowsFile()).toBeNull();
    expect(await host.saveFiles('x', [{ name: 'a.csv', data: '' }])).toBeNull();
  });

  it("rethrows main's message without Electron's IPC wrapping", async () => {
    // Electron wraps errors from ipcMain.handle as "Error invoking remote method '<channel>': <error>"
    // (Electron docs, ipcRenderer.invoke; wording from memory).
    const wrapped = new Error(`Error invoking remote method '${INVOKE_CHANNELS.saveFiles}': PayloadError: saveFiles: file 1 "../x.csv": the name contains '..'`);
    const { bridge } = fakeBridge({ saveFiles: async () => Promise.reject(wrapped) });
    await expect(electronHost(bridge).saveFiles('x', [{ name: '../x.csv', data: '' }])).rejects.toThrow(/^saveFiles: file 1 "..\/x.csv": the name contains '..'$/);
  });

  it('relays menu commands and unsubscribes', () => {
    const { bridge, listeners } = fakeBridge();
    const seen: MenuCommand[] = [];
    const off = electronHost(bridge).onMenuCommand?.((c) => seen.push(c));
    listeners.forEach((l) => l('export'));
    off?.();
    expect(seen).toEqual(['export']);
    expect(listeners).toHaveLength(0);
  });
});

describe('electronHost raw folders', () => {
  it('lists the folder main chose and reads files by id and base name, clipped to their size', async () => {
    const { bridge, calls } = fakeBridge();
    const folder = await electronHost(bridge).chooseRawFolder();
    expect(folder?.names).toEqual(['S01.edf']);
    expect(await folder!.open('S02.edf')).toBeNull();
    const source = await folder!.open('raw/S01.edf');
    expect(source?.size).toBe(10);
    expect([...(await source!.read(8, 100))]).toEqual([8, 9]);
    expect((await source!.read(10, 5)).length).toBe(0);
    // One clipped block read for both: the adapter caches blocks of the file.
    expect(calls.filter((c) => c.method === 'readRaw')).toEqual([{ method: 'readRaw', args: [3, 'S01.edf', 0, 10] }]);
  });

  it('returns null when main has no demo raw folder', async () => {
    expect(await electronHost(fakeBridge().bridge).demoRawFolder()).toBeNull();
  });
});

describe('unwrapRemoteError(err)', () => {
  it('keeps other errors as they are and wraps non-errors', () => {
    const plain = new Error('disk full');
    expect(unwrapRemoteError(plain)).toBe(plain);
    expect(unwrapRemoteError('boom').message).toBe('boom');
    expect(unwrapRemoteError(new Error("Error invoking remote method 'gleaner:load-demo': Error: demo missing")).message).toBe('demo missing');
  });
});

describe('channel list (electron/channels.ts)', () => {
  it('has one distinct channel per bridge request method', () => {
    const methods: (keyof ElectronBridge)[] = [
      'openWindowsFile', 'loadDemo', 'saveFiles',
      'saveStudy', 'openStudy', 'recentStudies', 'writeAutosave', 'readAutosave', 'clearAutosave',
      'chooseRawFolder', 'demoRawFolder', 'readRaw',
    ];
    expect(Object.keys(INVOKE_CHANNELS).sort()).toEqual([...methods].sort());
    const names = [...Object.values(INVOKE_CHANNELS), MENU_CHANNEL];
    expect(new Set(names).size).toBe(names.length);
  });

  it('accepts only the known menu commands', () => {
    expect(MENU_COMMANDS.every(isMenuCommand)).toBe(true);
    expect(isMenuCommand('quit')).toBe(false);
    expect(isMenuCommand({ command: 'open' })).toBe(false);
  });
});
