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

/** A raw-signal folder remembered in main: the renderer names it by id and its files by base name. */
export interface BridgeRawFolder {
  id: number;
  /** The folder's own name, for messages. */
  label: string;
  files: { name: string; size: number }[];
}

export interface BridgeSavedStudy {
  name: string;
  location: string;
}

export interface BridgeAutosave {
  key: string;
  studyName: string | null;
  inputName: string;
  savedAt: number;
  bytes: Uint8Array;
}

export interface PreloadApi {
  openWindowsFile(): Promise<BridgeOpenedFile | null>;
  loadDemo(): Promise<BridgeOpenedFile>;
  saveFiles(suggestedFolder: string, files: BridgeFileToWrite[]): Promise<BridgeSaveOutcome | null>;
  /** Subscribes to File-menu commands; returns the unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommandName) => void): () => void;
  /** Asks for a folder of raw-signal files; null when the user cancels. */
  chooseRawFolder(): Promise<BridgeRawFolder | null>;
  /** The demo study's raw folder shipped with the app; null when it was not generated. */
  demoRawFolder(): Promise<BridgeRawFolder | null>;
  /** Bytes [offset, offset + length) of a file listed in a chosen folder, clipped to its end. */
  readRaw(folderId: number, name: string, offset: number, length: number): Promise<Uint8Array>;
  saveStudy(suggestedName: string, bytes: Uint8Array, saveAs: boolean): Promise<BridgeSavedStudy | null>;
  openStudy(recent: string | null): Promise<BridgeOpenedFile | null>;
  recentStudies(): Promise<string[]>;
  writeAutosave(entry: BridgeAutosave): Promise<void>;
  readAutosave(key: string | null): Promise<BridgeAutosave | null>;
  clearAutosave(key: string): Promise<void>;
}
