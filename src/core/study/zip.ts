import { crc32 } from './crc32';

/**
 * A minimal ZIP archive (PKWARE APPNOTE.TXT 6.3): entries stored uncompressed (method 0) with their
 * CRC-32, a local file header before each entry's bytes, a central directory and an end-of-central-
 * directory record. Names are UTF-8 (general purpose flag bit 11). No ZIP64: the archive stays below
 * 4 GiB and 65535 entries. The date fields hold a fixed time (1980-01-01 00:00) so the same entries
 * always give the same bytes.
 */
export interface ZipEntry {
  name: string;
  data: Uint8Array;
}

const LOCAL = 0x04034b50;
const CENTRAL = 0x02014b50;
const END = 0x06054b50;
const UTF8_FLAG = 0x0800;
/** MS-DOS date of 1980-01-01: ((1980 - 1980) << 9) | (1 << 5) | 1. */
const DOS_DATE = 0x21;

/** The archive holding the entries in the order given. */
export function writeZip(entries: readonly ZipEntry[]): Uint8Array {
  if (entries.length > 0xffff) throw new Error(`writeZip: ${entries.length} entries; at most 65535 without ZIP64`);
  const encoder = new TextEncoder();
  const names = entries.map((e) => encoder.encode(e.name));
  const crcs = entries.map((e) => crc32(e.data));
  let localSize = 0;
  let centralSize = 0;
  for (let i = 0; i < entries.length; i++) {
    localSize += 30 + names[i].length + entries[i].data.length;
    centralSize += 46 + names[i].length;
  }
  const total = localSize + centralSize + 22;
  if (total > 0xffffffff) throw new Error('writeZip: archive over 4 GiB needs ZIP64');
  const out = new Uint8Array(total);
  const view = new DataView(out.buffer);
  const offsets: number[] = [];
  let at = 0;
  for (let i = 0; i < entries.length; i++) {
    offsets.push(at);
    const size = entries[i].data.length;
    view.setUint32(at, LOCAL, true);
    view.setUint16(at + 4, 20, true); // version needed: 2.0
    view.setUint16(at + 6, UTF8_FLAG, true);
    view.setUint16(at + 8, 0, true); // method: stored
    view.setUint16(at + 10, 0, true); // time
    view.setUint16(at + 12, DOS_DATE, true);
    view.setUint32(at + 14, crcs[i], true);
    view.setUint32(at + 18, size, true);
    view.setUint32(at + 22, size, true);
    view.setUint16(at + 26, names[i].length, true);
    view.setUint16(at + 28, 0, true);
    out.set(names[i], at + 30);
    out.set(entries[i].data, at + 30 + names[i].length);
    at += 30 + names[i].length + size;
  }
  const centralStart = at;
  for (let i = 0; i < entries.length; i++) {
    const size = entries[i].data.length;
    view.setUint32(at, CENTRAL, true);
    view.setUint16(at + 4, 20, true); // made by: 2.0, MS-DOS attributes
    view.setUint16(at + 6, 20, true);
    view.setUint16(at + 8, UTF8_FLAG, true);
    view.setUint16(at + 10, 0, true);
    view.setUint16(at + 12, 0, true);
    view.setUint16(at + 14, DOS_DATE, true);
    view.setUint32(at + 16, crcs[i], true);
    view.setUint32(at + 20, size, true);
    view.setUint32(at + 24, size, true);
    view.setUint16(at + 28, names[i].length, true);
    // extra length, comment length, disk number, internal and external attributes: 0
    view.setUint32(at + 42, offsets[i], true);
    out.set(names[i], at + 46);
    at += 46 + names[i].length;
  }
  view.setUint32(at, END, true);
  view.setUint16(at + 8, entries.length, true);
  view.setUint16(at + 10, entries.length, true);
  view.setUint32(at + 12, at - centralStart, true);
  view.setUint32(at + 16, centralStart, true);
  return out;
}

/**
 * The entries of a stored (uncompressed) ZIP archive, read through its central directory. Throws
 * an Error naming what is wrong (the caller adds the file name); checks every entry's CRC-32.
 */
export function readZip(bytes: Uint8Array): ZipEntry[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let end = -1;
  for (let i = bytes.length - 22; i >= Math.max(0, bytes.length - 22 - 0xffff); i--) {
    if (view.getUint32(i, true) === END) {
      end = i;
      break;
    }
  }
  if (end < 0) throw new Error('a ZIP archive (no end-of-central-directory record found)');
  const count = view.getUint16(end + 10, true);
  let at = view.getUint32(end + 16, true);
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const entries: ZipEntry[] = [];
  for (let i = 0; i < count; i++) {
    if (at + 46 > bytes.length || view.getUint32(at, true) !== CENTRAL) throw new Error(`a central directory entry ${i + 1} at byte ${at}`);
    const method = view.getUint16(at + 10, true);
    const crc = view.getUint32(at + 16, true);
    const size = view.getUint32(at + 20, true);
    const nameLen = view.getUint16(at + 28, true);
    const extraLen = view.getUint16(at + 30, true);
    const commentLen = view.getUint16(at + 32, true);
    const local = view.getUint32(at + 42, true);
    const name = decoder.decode(bytes.subarray(at + 46, at + 46 + nameLen));
    if (method !== 0) throw new Error(`entry "${name}" stored without compression (method 0), found method ${method}`);
    if (local + 30 > bytes.length || view.getUint32(local, true) !== LOCAL) throw new Error(`a local header for entry "${name}" at byte ${local}`);
    const dataStart = local + 30 + view.getUint16(local + 26, true) + view.getUint16(local + 28, true);
    if (dataStart + size > bytes.length) throw new Error(`entry "${name}" to hold ${size} bytes (the archive is cut short)`);
    const data = bytes.slice(dataStart, dataStart + size);
    if (crc32(data) !== crc) throw new Error(`entry "${name}" to match its CRC-32 (the archive is damaged)`);
    entries.push({ name, data });
    at += 46 + nameLen + extraLen + commentLen;
  }
  return entries;
}
