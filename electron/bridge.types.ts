/**
 * The shapes crossing the preload bridge, as main and the preload see them. They mirror
 * `ElectronBridge` in src/host/host.ts (electron/ may not import src/host); a type test in
 * test/host/bridge.test.ts checks that the two stay assignable to each other.
 */
import type { MenuCommandName } from './channels.ts';

export interface BridgeOpenedFile {
  name: string;
  bytes: Uint8Array;
  path?: string;
}

export interface BridgeFileToWrite {
  name: string;
  data: string | Uint8Array;
}

export interface BridgeSaveOutcome {
  location: string;
  names: string[];
}

export interface PreloadApi {
  openWindowsFile(): Promise<BridgeOpenedFile | null>;
  loadDemo(): Promise<BridgeOpenedFile>;
  saveFiles(suggestedFolder: string, files: BridgeFileToWrite[]): Promise<BridgeSaveOutcome | null>;
  /** Subscribes to File-menu commands; returns the unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommandName) => void): () => void;
}
