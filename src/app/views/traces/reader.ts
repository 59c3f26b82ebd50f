import { linkWindows, type RawLinkSpec, type WindowLink } from '../../../core/raw/link';
import { openRawSource } from '../../../core/raw/open';
import type { RawSource, RawSpan } from '../../../core/raw/span.types';
import type { RawFolder } from '../../../host/host';
import { baseName } from '../../../host/raw-folder';
import type { TraceWindow } from './windows';

/** One trace as drawn: the window, and either its samples with context or why there are none. */
export type Trace =
  | { window: TraceWindow; state: 'loading' }
  | { window: TraceWindow; state: 'message'; message: string }
  | {
      window: TraceWindow;
      state: 'ok';
      span: RawSpan;
      /** Window start and end in source seconds. */
      start: number;
      end: number;
      /** The drawn stretch: the window with its context margin. */
      from: number;
      to: number;
      /** File the samples came from (base name). */
      file: string;
    };

/**
 * Opens raw files through a RawFolder (each once, headers only) and reads spans on demand. The
 * readers fetch only the byte ranges a span needs, so this runs on the UI thread with async I/O:
 * a 10 s span of a few channels at 50 Hz is a few kilobytes to decode.
 */
export class TraceReader {
  private readonly sources = new Map<string, Promise<RawSource | null>>();

  constructor(readonly folder: RawFolder, readonly spec: RawLinkSpec) {}

  private open(path: string): Promise<RawSource | null> {
    const name = baseName(path);
    let pending = this.sources.get(name);
    if (!pending) {
      pending = this.folder.open(name).then((bytes) => (bytes ? openRawSource(bytes, name) : null));
      this.sources.set(name, pending);
    }
    return pending;
  }

  /** The first source that opens, for the channel list (null when none does). */
  async firstSource(windows: readonly TraceWindow[]): Promise<RawSource | null> {
    const links = await this.link(windows);
    const ok = links.find((l) => l.ok);
    return ok && ok.ok ? ok.source : null;
  }

  link(windows: readonly TraceWindow[]): Promise<WindowLink[]> {
    return linkWindows(windows.map((w) => w.link), this.spec, (path) => this.open(path));
  }

  /** Reads one linked window with `margin` seconds of context each side. */
  async read(window: TraceWindow, link: WindowLink, margin: number, channels: readonly string[]): Promise<Trace> {
    if (!link.ok) return { window, state: 'message', message: this.phrase(link.message) };
    const have = channels.filter((c) => link.source.channels.some((x) => x.label === c));
    if (have.length === 0) return { window, state: 'message', message: `${baseName(link.path)} has none of the chosen channels (${channels.join(', ')})` };
    try {
      const from = link.start - margin, to = link.end + margin;
      const span = await link.source.readSpan(from, to, have);
      return { window, state: 'ok', span, start: link.start, end: link.end, from, to, file: baseName(link.path) };
    } catch (err) {
      return { window, state: 'message', message: `${baseName(link.path)} cannot be read: ${err instanceof Error ? err.message : String(err)}` };
    }
  }

  private phrase(message: string): string {
    return message.includes('not found') ? `${message} in ${this.folder.label}` : message;
  }
}
