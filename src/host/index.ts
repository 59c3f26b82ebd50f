import { browserHost } from './browser-host';
import { electronHost } from './electron-host';
import type { ElectronBridge, Host } from './host';

/** The host for this window: Electron's bridge when the preload exposed one, else browser mode. */
export function pickHost(): Host {
  const bridge = (window as unknown as { gleanerHost?: ElectronBridge }).gleanerHost;
  return bridge ? electronHost(bridge) : browserHost();
}

export type { FileToWrite, Host, OpenedFile, SaveOutcome } from './host';
