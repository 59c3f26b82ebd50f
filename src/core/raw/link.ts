import { InputError } from '../errors';
import { parseCsv } from '../table/csv';
import { cellText, type Table } from '../table/table';
import { isoFromEpoch } from './civil-time';
import { ABSOLUTE_SECONDS } from './csv/time-value';
import type { RawSource } from './span.types';

/** Where each subject's (and session's) raw file is: a file-name pattern or a manifest table. */
export type RawLinkSpec = { pattern: string } | { manifest: ManifestEntry[] };

export interface ManifestEntry {
  subject: string;
  /** Absent: the file serves every session of the subject. */
  session?: string;
  path: string;
  /** Seconds added to window times before they are looked up in the file (clock differences). */
  offset: number;
}

/** A window as the linker needs it; times as in the windows table (Unix seconds or relative seconds). */
export interface LinkWindow {
  id: string;
  subject: string;
  session?: string;
  start: number;
  end: number;
}

export type WindowLink =
  | { id: string; ok: true; path: string; source: RawSource; start: number; end: number }
  | { id: string; ok: false; path?: string; message: string };

/**
 * Reads a manifest CSV with columns subject, path and optionally session and offset (seconds).
 * Problems are InputErrors naming the file, row and column.
 */
export function parseManifest(bytes: Uint8Array, fileName: string): ManifestEntry[] {
  const table = parseCsv(bytes, fileName);
  const col = (name: string, required: boolean) => {
    const c = table.columns.find((x) => x.name.trim().toLowerCase() === name);
    if (!c && required) throw new InputError({ file: fileName, row: 1, expected: `a "${name}" column (manifest columns: subject, session, path, offset)`, found: table.columns.map((x) => x.name).join(',') });
    return c;
  };
  const subject = col('subject', true)!;
  const path = col('path', true)!;
  const session = col('session', false);
  const offset = col('offset', false);
  const out: ManifestEntry[] = [];
  for (let r = 0; r < table.nRows; r++) {
    const s = cellText(subject, r);
    const p = cellText(path, r);
    if (s === '') throw new InputError({ file: fileName, row: r + 2, column: subject.name, expected: 'a subject id' });
    if (p === '') throw new InputError({ file: fileName, row: r + 2, column: path.name, expected: 'the path of a raw-signal file' });
    let o = 0;
    if (offset) {
      const text = cellText(offset, r);
      o = text === '' ? 0 : Number(text);
      if (!Number.isFinite(o)) throw new InputError({ file: fileName, row: r + 2, column: offset.name, expected: 'seconds, a number', found: text });
    }
    const sess = session ? cellText(session, r) : '';
    out.push({ subject: s, ...(sess !== '' ? { session: sess } : {}), path: p, offset: o });
  }
  return out;
}

/** The raw file of a subject (and session), or a message saying why there is none. */
export function rawPathFor(spec: RawLinkSpec, subject: string, session?: string): { path: string; offset: number } | { message: string } {
  if ('pattern' in spec) {
    if (spec.pattern.includes('{session}') && !session) return { message: `the file pattern "${spec.pattern}" needs a session, and the window has none` };
    return { path: spec.pattern.replaceAll('{subject}', subject).replaceAll('{session}', session ?? ''), offset: 0 };
  }
  const hit = spec.manifest.find((e) => e.subject === subject && e.session === session) ?? spec.manifest.find((e) => e.subject === subject && e.session === undefined);
  if (!hit) return { message: `the manifest lists no raw file for subject ${subject}${session ? `, session ${session}` : ''}` };
  return { path: hit.path, offset: hit.offset };
}

/** Seconds on the source's axis of a window time. Absolute window times are mapped through the source's start. */
export function toSourceTime(windowTime: number, source: RawSource, offset: number): number {
  const t = windowTime + offset;
  return source.startEpoch !== null && windowTime >= ABSOLUTE_SECONDS ? t - source.startEpoch : t;
}

/** Maps one window into its source, or says in words why it does not fit. */
export function mapWindow(w: LinkWindow, source: RawSource, path: string, offset: number): WindowLink {
  const start = toSourceTime(w.start, source, offset);
  const end = toSourceTime(w.end, source, offset);
  const cov = source.coverage;
  const eps = 1e-6;
  if (cov.some((c) => start >= c.start - eps && end <= c.end + eps)) return { id: w.id, ok: true, path, source, start, end };
  const when = (s: number) => (source.startEpoch !== null ? isoFromEpoch(source.startEpoch + s) : `${round(s)} s`);
  const span = `${when(start)} to ${when(end)}`;
  if (cov.length === 0) return { id: w.id, ok: false, path, message: `window ${w.id}: ${path} holds no samples` };
  const first = cov[0].start;
  const last = cov[cov.length - 1].end;
  let why: string;
  if (end <= first + eps || start >= last - eps) why = `is outside its recording, which covers ${when(first)} to ${when(last)}`;
  else if (start < first - eps || end > last + eps) why = `runs past the edge of its recording, which covers ${when(first)} to ${when(last)}`;
  else why = 'falls partly or wholly in a gap of the recording (no samples there)';
  return { id: w.id, ok: false, path, message: `window ${w.id} (${span}) ${why} in ${path}` };
}

/**
 * Links every window to its raw file. `open` returns null for a missing file (and may throw an
 * InputError for a bad one); each file is opened once. Every window gets a result or a message.
 */
export async function linkWindows(windows: readonly LinkWindow[], spec: RawLinkSpec, open: (path: string) => Promise<RawSource | null>): Promise<WindowLink[]> {
  const opened = new Map<string, Promise<RawSource | string>>();
  const out: WindowLink[] = [];
  for (const w of windows) {
    const where = rawPathFor(spec, w.subject, w.session);
    if ('message' in where) {
      out.push({ id: w.id, ok: false, message: `window ${w.id}: ${where.message}` });
      continue;
    }
    let pending = opened.get(where.path);
    if (!pending) {
      pending = open(where.path).then(
        (s) => s ?? `raw file ${where.path} not found`,
        (e: unknown) => `raw file ${where.path} cannot be read: ${e instanceof Error ? e.message : String(e)}`,
      );
      opened.set(where.path, pending);
    }
    const source = await pending;
    if (typeof source === 'string') out.push({ id: w.id, ok: false, path: where.path, message: `window ${w.id} (subject ${w.subject}): ${source}` });
    else out.push(mapWindow(w, source, where.path, where.offset));
  }
  return out;
}

/** The windows of a parsed windows table, for linking (the caller names the columns, e.g. from roles). */
export function linkWindowsOf(table: Table, columns: { id: string; subject: string; session?: string; start: string; end: string }): LinkWindow[] {
  const get = (name: string) => {
    const c = table.columns.find((x) => x.name === name);
    if (!c) throw new InputError({ file: table.fileName, row: 1, column: name, expected: 'this column in the windows table' });
    return c;
  };
  const [id, subject, start, end] = [get(columns.id), get(columns.subject), get(columns.start), get(columns.end)];
  const session = columns.session ? get(columns.session) : undefined;
  return Array.from({ length: table.nRows }, (_, r) => {
    const sess = session ? cellText(session, r) : '';
    return {
      id: cellText(id, r), subject: cellText(subject, r), ...(sess ? { session: sess } : {}),
      start: Number(cellText(start, r)), end: Number(cellText(end, r)),
    };
  });
}

function round(s: number): string {
  return String(Math.round(s * 1000) / 1000);
}
