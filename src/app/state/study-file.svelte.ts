import { version } from '../../../package.json';
import type { AnalysisParams } from '../../core/analysis.types';
import { checkInputs, decodeStudy, encodeStudy, STUDY_SCHEMA_VERSION, type Study as StudyDoc, type StudyRun } from '../../core/study';
import type { AutosaveEntry, Host, InputFile, OpenedFile } from '../../host/host';
import { isoNow } from '../lib/clock';
import { describeError } from '../lib/errors';
import { baseName } from '../lib/export-files';
import type { Curation } from './curation.svelte';
import type { DockState } from './dock.svelte';
import type { MapState } from './map.svelte';
import type { RunParams } from './params.svelte';
import type { Selection } from './selection.svelte';
import type { Status } from './status.svelte';
import type { Study } from './study.svelte';
import type { ColourBy } from './map.svelte';
import type { Run } from '../../core/run/run.types';

/** Autosave checks for changes this often (ms): a crash loses at most about this much work. */
export const AUTOSAVE_EVERY_MS = 2000;
const STUDY_EXTENSION = '.gleaner';
/** The demo study's table name (browser mode offers the shipped copy when a study needs it). */
const DEMO_NAME = 'windows.csv';

/** A study read from a file or an autosave, waiting for its windows table. */
export interface PendingStudy {
  doc: StudyDoc;
  /** The study file's name (null for an autosave of a study never saved). */
  name: string | null;
  fromAutosave: boolean;
}

/** The view settings a study keeps (all optional when read back: older files may lack some). */
interface ViewSettings {
  colourBy?: ColourBy;
  dock?: string | null;
  params?: { k: number; seed: number; restarts: number };
}

/** What the study file reads and restores (given by AppState: no pointer back to it). */
export interface StudyFileDeps {
  readonly study: Study;
  readonly curation: Curation;
  readonly map: MapState;
  readonly dock: DockState;
  readonly params: RunParams;
  readonly selection: Selection;
  readonly status: Status;
  readonly host: Host;
  /** Opens a windows table (parse job); false when it did not load. */
  openFile(file: InputFile): Promise<boolean>;
}

/**
 * The study file: Save / Save As / Open / recent studies, the autosave every few seconds after a
 * change, and the restore offered after a crash. Opening restores every run, its curation and the
 * view settings without recomputing anything; it needs the windows table again (the study keeps
 * its name and SHA-256 only) and says so when that file has changed.
 */
export class StudyFile {
  /** The study file's name once saved or opened ('' = not saved yet). */
  name = $state('');
  recent = $state<string[]>([]);
  /** A study waiting for its windows table (the dialog asks for it). */
  pending = $state.raw<PendingStudy | null>(null);
  /** An autosave newer than the saved study, offered on start or open. */
  offer = $state.raw<AutosaveEntry | null>(null);
  /** The Export dialog is open. */
  exportOpen = $state(false);
  /** Autosaves written since start (tests wait on it). */
  autosaves = $state(0);
  /** Reactive, so the save marker updates the moment a save or open sets it. */
  private savedSignature = $state('');
  private autosavedSignature = '';
  private timer: ReturnType<typeof setInterval> | null = null;

  constructor(private readonly deps: StudyFileDeps) {}

  /** What changes when the user changes the study (runs, curation, view settings). */
  signature(): string {
    const app = this.deps;
    return `${app.study.source?.sha256 ?? ''}|${app.study.kept.length}|${app.study.run ? app.study.kept.findIndex((k) => k.run === app.study.run) : -1}|${app.curation.revision}|${app.map.colourBy}|${app.dock.view}|${app.params.k},${app.params.seed},${app.params.restarts}`;
  }

  /** Takes the study as it is now as the saved state (a study that opens finished, such as the demo). */
  markClean(): void {
    this.savedSignature = this.signature();
    this.autosavedSignature = this.savedSignature;
  }

  get dirty(): boolean {
    return !!this.deps.study.run && this.signature() !== this.savedSignature;
  }

  /** Starts the autosave timer and looks for an autosave to offer; call once at start. */
  async start(): Promise<void> {
    await this.refreshRecent();
    this.timer ??= setInterval(() => void this.autosave(), AUTOSAVE_EVERY_MS);
    try {
      const entry = await this.deps.host.readAutosave();
      if (entry && !this.deps.study.run) this.offer = entry;
    } catch {
      // No autosave store (private browsing): nothing to offer.
    }
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }

  async refreshRecent(): Promise<void> {
    this.recent = await this.deps.host.recentStudies().catch(() => []);
  }

  /** The study as a document (runs with results and curation, view settings). */
  toDoc(): StudyDoc {
    const { study, curation, map, dock, params } = this.deps;
    const source = study.source, table = study.table;
    if (!source || !table) throw new Error('there is no study to save: open a windows table first');
    const kept = study.kept.length > 0 ? study.kept.map((k) => k.run) : study.run ? [study.run] : [];
    const runs: StudyRun[] = kept.map((run, i) => ({
      id: `run-${i + 1}`,
      input: 0,
      roles: $state.snapshot(run.roles),
      params: { ...run.params } as unknown as Record<string, unknown>,
      result: run.result,
      curation: curation.recorded(run),
      flags: curation.identitiesOf(run).flatMap((id) => id.flags.map((f) => ({ cluster: id.number, flag: f.text, note: f.reason }))),
      createdAt: isoNow(),
    }));
    const view: ViewSettings = { colourBy: map.colourBy, dock: dock.view, params: { k: params.k, seed: params.seed, restarts: params.restarts } };
    return {
      schemaVersion: STUDY_SCHEMA_VERSION,
      app: { name: 'Gleaner', version },
      inputs: [{ fileName: source.fileName, path: source.fileName, sha256: source.sha256, rows: table.nRows }],
      runs,
      activeRun: study.run ? kept.indexOf(study.run) : -1,
      notes: '',
      view: view as Record<string, unknown>,
    };
  }

  async save(saveAs: boolean): Promise<void> {
    const source = this.deps.study.source;
    if (!source) return;
    try {
      const signature = this.signature();
      const bytes = encodeStudy(this.toDoc());
      const suggested = this.name || `${baseName(source.fileName)}${STUDY_EXTENSION}`;
      const saved = await this.deps.host.saveStudy(suggested, bytes, { saveAs });
      if (!saved) return this.deps.status.finish('Save cancelled.');
      this.name = saved.name;
      this.savedSignature = signature;
      this.autosavedSignature = signature;
      await this.deps.host.clearAutosave(source.sha256).catch(() => undefined);
      await this.refreshRecent();
      this.deps.status.finish(`Saved the study as ${saved.name} (${saved.location}).`);
    } catch (err) {
      this.deps.status.fail('Could not save the study', describeError(err, this.name || source.fileName), 'The study was not saved.');
    }
  }

  /** Asks for a study file (or opens a recent one) and reads it; the windows table is asked for next. */
  async open(recent?: string): Promise<void> {
    let file: OpenedFile | null = null;
    try {
      file = await this.deps.host.openStudy(recent);
      if (!file) return;
      const doc = decodeStudy(file.bytes, file.name);
      await this.refreshRecent();
      const key = doc.inputs[0]?.sha256;
      const autosave = key ? await this.deps.host.readAutosave(key).catch(() => null) : null;
      if (autosave && autosave.studyName === file.name) this.offer = autosave;
      this.pending = { doc, name: file.name, fromAutosave: false };
    } catch (err) {
      this.deps.status.fail('Could not open the study', describeError(err, file?.name ?? 'study'), this.deps.study.source ? 'The open study is unchanged.' : 'Nothing was opened.');
    }
  }

  /** Restores the offered autosave (it then waits for its windows table like an opened study). */
  restoreOffer(): void {
    const entry = this.offer;
    this.offer = null;
    if (!entry) return;
    try {
      const doc = decodeStudy(entry.bytes, `${entry.studyName ?? entry.inputName} (autosave)`);
      this.pending = { doc, name: entry.studyName, fromAutosave: true };
    } catch (err) {
      this.deps.status.fail('Could not restore the autosave', describeError(err, 'autosave'), 'Nothing was restored.');
    }
  }

  /** The offer stands until answered or until the user opens a table another way (then it is let go, the file kept). */
  get offerShown(): boolean {
    return !!this.offer && (!this.deps.study.source || !!this.pending);
  }

  async discardOffer(): Promise<void> {
    const entry = this.offer;
    this.offer = null;
    if (entry) await this.deps.host.clearAutosave(entry.key).catch(() => undefined);
  }

  /** The name of the windows table the pending study needs, and whether the demo can stand in. */
  get needs(): { fileName: string; sha256: string; demo: boolean } | null {
    const input = this.pending?.doc.inputs[0];
    return input ? { fileName: input.fileName, sha256: input.sha256, demo: input.fileName === DEMO_NAME } : null;
  }

  /** Gives the pending study its windows table: parses it (the only job), then restores everything else. */
  async provideInput(source: 'pick' | 'demo'): Promise<void> {
    const pending = this.pending;
    if (!pending) return;
    let file: InputFile | null;
    try {
      file = source === 'demo' ? await this.deps.host.loadDemo() : await this.deps.host.openWindowsFile();
    } catch (err) {
      return this.deps.status.fail('Could not open the windows table', describeError(err, 'file'), 'The study was not opened.');
    }
    if (!file) {
      this.pending = { ...pending }; // asks again
      return;
    }
    this.pending = null;
    if (!(await this.deps.openFile(file))) return;
    this.apply(pending);
  }

  cancelPending(): void {
    this.pending = null;
  }

  private apply(pending: PendingStudy): void {
    const app = this.deps;
    const { doc } = pending;
    const source = app.study.source, table = app.study.table;
    if (!source || !table) return;
    const input = doc.inputs[0];
    const label = pending.name ?? 'the autosave';
    if (input && table.nRows !== input.rows) {
      app.status.fail('The study does not fit this table', `${source.fileName}: expected ${input.rows} windows as in ${label}, found ${table.nRows}`, 'The table is open; its runs were not restored.');
      return;
    }
    const [check] = checkInputs(doc, [source.sha256]);
    const runs: Run[] = doc.runs.map((r) => ({
      result: r.result,
      params: r.params as unknown as AnalysisParams,
      roles: r.roles,
      featureNames: r.roles.filter((role) => role.role === 'feature').map((role) => role.name),
    }));
    runs.forEach((run) => app.study.setRun(run));
    runs.forEach((run, i) => app.curation.restore(run, doc.runs[i].curation));
    const active = doc.activeRun >= 0 && doc.activeRun < runs.length ? doc.activeRun : runs.length - 1;
    const kept = app.study.kept.find((k) => k.run === runs[active]);
    if (kept) app.study.show(kept.id);
    const view = doc.view as ViewSettings;
    if (typeof view.colourBy === 'string') app.map.colourBy = view.colourBy;
    if (view.dock === null || typeof view.dock === 'string') app.dock.view = view.dock;
    if (view.params) Object.assign(app.params, view.params);
    app.selection.clear();
    app.map.fitNext = true;
    this.name = pending.name ?? '';
    const signature = this.signature();
    this.autosavedSignature = signature;
    this.savedSignature = pending.fromAutosave ? '' : signature;
    const changed = check && check.status === 'changed' ? ` Warning: ${check.message}; the saved results may not match it.` : '';
    app.status.finish(`${pending.fromAutosave ? 'Restored the autosave' : `Opened ${pending.name}`}: ${runs.length} run${runs.length === 1 ? '' : 's'}, nothing recomputed.${changed}`);
    if (changed) app.status.error = { title: 'The windows table has changed', message: check.message };
  }

  /** Writes the autosave when something changed since the last one (called by the timer). */
  async autosave(): Promise<void> {
    const app = this.deps;
    const source = app.study.source;
    if (!source || !app.study.run || this.pending || this.offerShown) return;
    const signature = this.signature();
    if (signature === this.autosavedSignature || signature === this.savedSignature) return;
    try {
      const bytes = encodeStudy(this.toDoc());
      await app.host.writeAutosave({ key: source.sha256, studyName: this.name || null, inputName: source.fileName, savedAt: Date.now(), bytes });
      this.autosavedSignature = signature;
      this.autosaves++;
    } catch {
      // The next tick tries again; the status line is for the user's own actions.
    }
  }
}
