/**
 * The renderer's only door to files. Two implementations: Electron (via the preload's narrow
 * API, validated in main) and browser mode (file pickers, drag and drop, downloads).
 */
import type { BridgeRawFolder, RawFolder } from './raw-folder';

export interface OpenedFile {
  /** File name without directories, for messages and provenance. */
  name: string;
  bytes: Uint8Array;
  /** Full path where the host knows it (Electron); absent in browser mode. */
  path?: string;
}

/**
 * A windows table the app reads in slices (a browser File or Blob): its bytes go straight to the
 * compute worker, so the UI thread never holds the whole file.
 */
export interface StreamedFile {
  name: string;
  blob: Blob;
}

/** What the Open dialog, a drop or the demo give the app: a streamed file, or bytes read by the host (Electron). */
export type InputFile = OpenedFile | StreamedFile;

/** The Electron adapter: it reads whole files in main for now, so it always answers with bytes. */
export type ElectronHost = Omit<Host, 'openWindowsFile' | 'loadDemo'> & {
  openWindowsFile(): Promise<OpenedFile | null>;
  loadDemo(): Promise<OpenedFile>;
};

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
  openWindowsFile(): Promise<InputFile | null>;
  /** The demo study's windows table, shipped with the app. */
  loadDemo(): Promise<InputFile>;
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
  /**
   * Writes a study file (atomically where the platform allows). `saveAs` (or a study never saved)
   * asks the user where; otherwise it replaces the file the study was opened from or last saved to.
   * Null when the user cancels.
   */
  saveStudy(suggestedName: string, bytes: Uint8Array, options: { saveAs: boolean }): Promise<SavedStudy | null>;
  /** Asks the user for a study file (or opens the named recent one); null when cancelled. */
  openStudy(recent?: string): Promise<OpenedFile | null>;
  /** Studies saved or opened lately, newest first, as names to show (and pass back to openStudy). */
  recentStudies(): Promise<string[]>;
  /** Keeps an autosaved copy of unsaved work (browser: IndexedDB; desktop: "<study>.autosave" beside the study). */
  writeAutosave(entry: AutosaveEntry): Promise<void>;
  /** The newest autosave (for one input hash, or any), or null. */
  readAutosave(key?: string): Promise<AutosaveEntry | null>;
  /** Forgets the autosave of one input hash (after a save or a discard). */
  clearAutosave(key: string): Promise<void>;
  /** Asks for a folder of raw-signal files (EDF, CSV); null when the user cancels. */
  chooseRawFolder(): Promise<RawFolder | null>;
  /** The demo study's raw signals, shipped or served beside the app; null when they are absent. */
  demoRawFolder(): Promise<RawFolder | null>;
}

export interface SavedStudy {
  /** The study file's name as saved. */
  name: string;
  /** Where it went, in words for the status line. */
  location: string;
}

/** An autosaved study: unsaved edits kept every few seconds so a crash loses little. */
export interface AutosaveEntry {
  /** The input file's SHA-256 (one autosave per input table). */
  key: string;
  /** The study file it belongs to, when it was saved or opened from one. */
  studyName: string | null;
  /** The input windows table's file name, for the restore dialog. */
  inputName: string;
  /** When it was written (ms since 1970, the host's clock). */
  savedAt: number;
  bytes: Uint8Array;
}

/** A desktop-menu item the renderer carries out (it owns the study and the data to export). */
export type MenuCommand = 'open' | 'export';

/** The shape the Electron preload exposes on window.gleanerHost (see electron/preload.ts). */
export interface ElectronBridge {
  openWindowsFile(): Promise<OpenedFile | null>;
  loadDemo(): Promise<OpenedFile>;
  saveFiles(suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null>;
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
  saveStudy(suggestedName: string, bytes: Uint8Array, saveAs: boolean): Promise<SavedStudy | null>;
  openStudy(recent: string | null): Promise<OpenedFile | null>;
  recentStudies(): Promise<string[]>;
  writeAutosave(entry: AutosaveEntry): Promise<void>;
  readAutosave(key: string | null): Promise<AutosaveEntry | null>;
  clearAutosave(key: string): Promise<void>;
  chooseRawFolder(): Promise<BridgeRawFolder | null>;
  demoRawFolder(): Promise<BridgeRawFolder | null>;
  readRaw(folderId: number, name: string, offset: number, length: number): Promise<Uint8Array>;
}

export type { BridgeRawFolder, RawFolder } from './raw-folder';
