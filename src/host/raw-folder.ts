import type { ByteSource } from '../core/raw/byte-source';

/**
 * A folder of raw-signal files the app may read. Files are named by base name only (a link
 * pattern or manifest path is reduced to its last part), and read in ranges, never whole.
 */
export interface RawFolder {
  /** In words, for messages ("raw", "the demo's raw signals"). */
  label: string;
  /** The file names it holds, or null where they cannot be listed (files served over HTTP). */
  names: string[] | null;
  /** A byte source over the named file, or null when the folder has no such file. */
  open(name: string): Promise<ByteSource | null>;
}

/** A raw folder as Electron's main lists it (mirrors BridgeRawFolder in electron/bridge.types.ts). */
export interface BridgeRawFolder {
  id: number;
  label: string;
  files: { name: string; size: number }[];
}

/** The last part of a path, as raw folders name files ("raw/S01.edf" → "S01.edf"). */
export function baseName(path: string): string {
  const parts = path.split(/[/\\]/);
  return parts[parts.length - 1];
}
