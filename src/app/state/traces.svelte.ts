import type { ManifestEntry, RawLinkSpec } from '../../core/raw/link';
import type { RawChannelInfo } from '../../core/raw/span.types';
import type { RawFolder } from '../../host/host';

export type TraceScale = 'common' | 'per-trace';
export type TraceMode = 'multiples' | 'overlay';

/** Traces drawn at most (the selection's first windows beyond that are counted, not drawn). */
export const MAX_TRACES = 24;

/** Bounds of the settings, checked where they are set. */
export const TRACE_LIMITS = { maxMarginSeconds: 60, minPerGroup: 1, maxPerGroup: 12 } as const;

/**
 * The Traces view's settings: where the raw files are (a folder, and a file-name pattern or a
 * manifest), how much context around each window, which channels, the scale, the focused cluster
 * and how many typical and borderline members to show.
 */
export class TracesState {
  /** The chosen raw folder; null = the demo's raw signals served or shipped beside the app. */
  folder = $state.raw<RawFolder | null>(null);
  /** File-name pattern with {subject} and {session}; used when there is no manifest. */
  pattern = $state('{subject}.edf');
  manifest = $state.raw<ManifestEntry[] | null>(null);
  manifestName = $state('');
  marginSeconds = $state(2);
  /** Chosen channel labels; empty = the first three of the first file opened. */
  channels = $state<string[]>([]);
  /** Channels of the first raw file opened (for the chooser). */
  available = $state.raw<RawChannelInfo[]>([]);
  scale = $state<TraceScale>('common');
  mode = $state<TraceMode>('multiples');
  /** Focused cluster (-1 = none: the view shows the selection). */
  focus = $state(-1);
  /** N typical and N borderline members shown for a focused cluster. */
  perGroup = $state(4);

  get spec(): RawLinkSpec {
    return this.manifest ? { manifest: this.manifest } : { pattern: this.pattern };
  }

  setMargin(seconds: number): void {
    this.marginSeconds = Number.isFinite(seconds) ? Math.min(TRACE_LIMITS.maxMarginSeconds, Math.max(0, seconds)) : 2;
  }

  setPerGroup(n: number): void {
    this.perGroup = Number.isFinite(n) ? Math.min(TRACE_LIMITS.maxPerGroup, Math.max(TRACE_LIMITS.minPerGroup, Math.round(n))) : 4;
  }

  setPattern(pattern: string): void {
    this.pattern = pattern.trim() || '{subject}.edf';
    this.manifest = null;
    this.manifestName = '';
  }

  setManifest(name: string, entries: ManifestEntry[]): void {
    this.manifest = entries;
    this.manifestName = name;
  }

  /** The channels to read: the chosen ones that exist, else the first three available. */
  chosenChannels(): string[] {
    const chosen = this.channels.filter((c) => this.available.some((a) => a.label === c));
    return chosen.length > 0 ? chosen : this.available.slice(0, 3).map((c) => c.label);
  }

  toggleChannel(label: string): void {
    const current = this.chosenChannels();
    this.channels = current.includes(label) ? current.filter((c) => c !== label) : [...current, label];
  }
}
