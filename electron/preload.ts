/**
 * The sandboxed preload: exposes one narrow API as window.gleanerHost, one method per channel.
 * The IPC event object never reaches the page. Bundled to one CommonJS file (a sandboxed preload
 * cannot require local modules).
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import type { BridgeAutosave, BridgeFileToWrite, BridgeOpenedFile, BridgeRawFolder, BridgeSavedStudy, BridgeSaveOutcome, PreloadApi } from './bridge.types.ts';
import { INVOKE_CHANNELS, isMenuCommand, MENU_CHANNEL, type MenuCommandName } from './channels.ts';

const api: PreloadApi = {
  openWindowsFile: (): Promise<BridgeOpenedFile | null> => ipcRenderer.invoke(INVOKE_CHANNELS.openWindowsFile),
  loadDemo: (): Promise<BridgeOpenedFile> => ipcRenderer.invoke(INVOKE_CHANNELS.loadDemo),
  saveFiles: (suggestedFolder: string, files: BridgeFileToWrite[]): Promise<BridgeSaveOutcome | null> =>
    ipcRenderer.invoke(INVOKE_CHANNELS.saveFiles, suggestedFolder, files),
  saveStudy: (suggestedName: string, bytes: Uint8Array, saveAs: boolean): Promise<BridgeSavedStudy | null> =>
    ipcRenderer.invoke(INVOKE_CHANNELS.saveStudy, suggestedName, bytes, saveAs),
  openStudy: (recent: string | null): Promise<BridgeOpenedFile | null> => ipcRenderer.invoke(INVOKE_CHANNELS.openStudy, recent),
  recentStudies: (): Promise<string[]> => ipcRenderer.invoke(INVOKE_CHANNELS.recentStudies),
  writeAutosave: (entry: BridgeAutosave): Promise<void> => ipcRenderer.invoke(INVOKE_CHANNELS.writeAutosave, entry),
  readAutosave: (key: string | null): Promise<BridgeAutosave | null> => ipcRenderer.invoke(INVOKE_CHANNELS.readAutosave, key),
  clearAutosave: (key: string): Promise<void> => ipcRenderer.invoke(INVOKE_CHANNELS.clearAutosave, key),
  chooseRawFolder: (): Promise<BridgeRawFolder | null> => ipcRenderer.invoke(INVOKE_CHANNELS.chooseRawFolder),
  demoRawFolder: (): Promise<BridgeRawFolder | null> => ipcRenderer.invoke(INVOKE_CHANNELS.demoRawFolder),
  readRaw: (folderId: number, name: string, offset: number, length: number): Promise<Uint8Array> =>
    ipcRenderer.invoke(INVOKE_CHANNELS.readRaw, folderId, name, offset, length),
  onMenuCommand: (listener: (command: MenuCommandName) => void): (() => void) => {
    const relay = (_event: IpcRendererEvent, command: unknown): void => {
      if (isMenuCommand(command)) listener(command);
    };
    ipcRenderer.on(MENU_CHANNEL, relay);
    return () => {
      ipcRenderer.removeListener(MENU_CHANNEL, relay);
    };
  },
};

contextBridge.exposeInMainWorld('gleanerHost', api);
