/**
 * The sandboxed preload: exposes one narrow API as window.gleanerHost, one method per channel.
 * The IPC event object never reaches the page. Bundled to one CommonJS file (a sandboxed preload
 * cannot require local modules).
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import type { BridgeFileToWrite, BridgeOpenedFile, BridgeSaveOutcome, PreloadApi } from './bridge.types.ts';
import { INVOKE_CHANNELS, isMenuCommand, MENU_CHANNEL, type MenuCommandName } from './channels.ts';

const api: PreloadApi = {
  openWindowsFile: (): Promise<BridgeOpenedFile | null> => ipcRenderer.invoke(INVOKE_CHANNELS.openWindowsFile),
  loadDemo: (): Promise<BridgeOpenedFile> => ipcRenderer.invoke(INVOKE_CHANNELS.loadDemo),
  saveFiles: (suggestedFolder: string, files: BridgeFileToWrite[]): Promise<BridgeSaveOutcome | null> =>
    ipcRenderer.invoke(INVOKE_CHANNELS.saveFiles, suggestedFolder, files),
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
