/**
 * The renderer's only door to files. Two implementations: Electron (via the preload's narrow
 * API, validated in main) and browser mode (file pickers, drag and drop, downloads).
 */

export interface OpenedFile {
  /** File name without directories, for messages and provenance. */
  name: string;
  bytes: Uint8Array;
  /** Full path where the host knows it (Electron); absent in browser mode. */
  path?: string;
}

export interface FileToWrite {
  /** Plain file name (no directories). */
  name: string;
  /** Text is written as UTF-8. */
  data: string | Uint8Array;
}

export interface SaveOutcome {
  /** Where the files went, in words for the status line ("~/labels", "your Downloads folder"). */
  location: string;
  names: string[];
}

export interface Host {
  readonly kind: 'electron' | 'browser';
  /** Asks the user for a windows table; null when they cancel. */
  openWindowsFile(): Promise<OpenedFile | null>;
  /** The demo study's windows table, shipped with the app. */
  loadDemo(): Promise<OpenedFile>;
  /**
   * Writes a set of files together into a place the user picks (never over an input file);
   * each write is atomic where the platform allows. Null when the user cancels.
   */
  saveFiles(suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null>;
  /**
   * Subscribes to the desktop menu's File > Open… and File > Export… (Electron only; absent in
   * browser mode, where the app's own buttons do the same). Returns the unsubscribe function.
   */
  onMenuCommand?(listener: (command: MenuCommand) => void): () => void;
}

/** A desktop-menu item the renderer carries out (it owns the study and the data to export). */
export type MenuCommand = 'open' | 'export';

/** The shape the Electron preload exposes on window.gleanerHost (see electron/preload.ts). */
export interface ElectronBridge {
  openWindowsFile(): Promise<OpenedFile | null>;
  loadDemo(): Promise<OpenedFile>;
  saveFiles(suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null>;
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
}
