import { describe, expect, it } from 'vitest';
import { edfAnnotationFiles } from '../../../src/core/export/edf-annotations';
import { EVENTS_TSV_HEADER, eventsTsv } from '../../../src/core/export/events-tsv';
import { eventSegments } from '../../../src/core/export/segments';
import { clusterIdentities } from '../../../src/core/export/run-model';
import { emptyNote } from '../../../src/core/curation/initial-state';
import { epochFromCivil } from '../../../src/core/raw/civil-time';
import { bytesSource } from '../../../src/core/raw/byte-source';
import { openEdf } from '../../../src/core/raw/edf/read';
import type { Roles } from '../../../src/core/table/roles.types';
import type { Column, Table } from '../../../src/core/table/table';

function text(name: string, values: string[]): Column {
  const dictionary = [...new Set(values.filter((v) => v !== ''))];
  return { kind: 'categorical', name, dictionary, codes: Int32Array.from(values, (v) => (v === '' ? -1 : dictionary.indexOf(v))) };
}
function num(name: string, values: number[]): Column {
  return { kind: 'numeric', name, values: Float64Array.from(values) };
}

// Two subjects; S01 has windows out of order, a gap (25 → 30) and a set-aside window; S02 starts at an epoch time.
const T0 = epochFromCivil({ year: 2026, month: 3, day: 2, hour: 7, minute: 58, second: 0 });
const table: Table = {
  fileName: 'w.csv',
  nRows: 9,
  columns: [
    text('pid', ['S01', 'S01', 'S01', 'S01', 'S01', 'S01', 'S02', 'S02', 'S02']),
    text('ses', ['', '', '', '', '', '', 'a', 'a', 'a']),
    num('t0', [105, 100, 110, 115, 130, 120, T0, T0 + 2.5, T0 + 5]),
    num('dur', [5, 5, 5, 5, 5, 5, 2.5, 2.5, 2.5]),
  ],
};
const roles: Roles = [
  { name: 'pid', role: 'subject', evidence: '' },
  { name: 'ses', role: 'session', evidence: '' },
  { name: 't0', role: 'start', evidence: '' },
  { name: 'dur', role: 'duration', evidence: '' },
];
// By start, S01: 100 c0, 105 c0, 110 c0, 115 c1, 120 c2 (set aside), 130 c1; S02: c0 c0 c1.
const labels = Int32Array.from([0, 0, 0, 1, 1, 2, 0, 0, 1]);
const confidence = Float32Array.from([0.5, 1, 0.25, 0.5, 0.5, 0.5, 1, 0.5, 0.75]);
/** Cluster 1 (index 0) is the class "walking", 2 a candidate, 3 set aside. */
function identitiesOf(l: Int32Array, aside = true) {
  const clusters = [{ ...emptyNote(), className: 'walking' }, emptyNote(), { ...emptyNote(), setAside: aside }];
  return clusterIdentities({ state: { labels: l, clusters } });
}
const identities = identitiesOf(labels);

describe('eventSegments', () => {
  it('merges consecutive windows of one class per subject and session; set-aside windows and gaps break segments', () => {
    const segs = eventSegments({ table, roles, labels, confidence, identities });
    expect(segs.map((s) => [s.subject, s.session, s.onset, s.duration, s.trialType, s.windows])).toEqual([
      ['S01', '', 0, 15, 'walking', 3],
      ['S01', '', 15, 5, 'candidate 2', 1],
      ['S01', '', 30, 5, 'candidate 2', 1],
      ['S02', 'a', 0, 5, 'walking', 2],
      ['S02', 'a', 5, 2.5, 'candidate 2', 1],
    ]);
    expect(segs[0].meanConfidence).toBeCloseTo((0.5 + 1 + 0.25) / 3, 6);
  });

  it('leaves candidates out when asked, and joins across a gap up to maxGap', () => {
    const segs = eventSegments({ table, roles, labels, confidence, identities: identitiesOf(labels, false), options: { includeCandidates: false } });
    expect(segs.map((s) => s.trialType)).toEqual(['walking', 'walking']);
    const joined = eventSegments({ table, roles, labels: new Int32Array(9), confidence, identities, options: { maxGap: 5 } });
    expect(joined.map((s) => [s.subject, s.duration])).toEqual([['S01', 35], ['S02', 7.5]]);
  });

  it('asks for a start column when the table has none', () => {
    expect(() => eventSegments({ table, roles: roles.filter((r) => r.role !== 'start'), labels, confidence, identities })).toThrow(/start column/);
  });
});

describe('eventsTsv(segments)', () => {
  it('follows the BIDS events rules: tab-separated, onset and duration (seconds) first, n/a for missing', () => {
    const tsv = eventsTsv(eventSegments({ table, roles, labels, confidence, identities }));
    const lines = tsv.split('\n');
    expect(lines.pop()).toBe('');
    const rows = lines.map((l) => l.split('\t'));
    // BIDS specification 1.9, "Modality agnostic files" → "Task events": onset and duration REQUIRED as the
    // first two columns, in seconds; trial_type OPTIONAL. "Common principles" → "Tabular files": tab-separated,
    // header row, missing values written "n/a".
    expect(rows[0].slice(0, 3)).toEqual(['onset', 'duration', 'trial_type']);
    expect(rows[0]).toEqual(EVENTS_TSV_HEADER);
    expect(rows.every((r) => r.length === EVENTS_TSV_HEADER.length)).toBe(true);
    expect(rows[1].slice(0, 5)).toEqual(['0', '15', 'walking', 'S01', 'n/a']); // no session column value: n/a
    expect(rows[2].slice(0, 3)).toEqual(['15', '5', 'candidate 2']);
    expect(rows[4].slice(0, 5)).toEqual(['0', '5', 'walking', 'S02', 'a']);
    expect(rows[4][9]).toBe(String(T0));
    for (const r of rows.slice(1)) {
      expect(Number(r[0])).toBeGreaterThanOrEqual(0);
      expect(Number(r[1])).toBeGreaterThanOrEqual(0);
      expect(r.includes('')).toBe(false);
    }
  });
});

describe('edfAnnotationFiles(segments)', () => {
  it('writes one EDF+C annotation file per subject that the project EDF+ reader reads back with identical onsets and texts', async () => {
    const segs = eventSegments({ table, roles, labels, confidence, identities });
    const files = edfAnnotationFiles(segs);
    expect(files.map((f) => f.name)).toEqual(['sub-S01_annotations.edf', 'sub-S02_ses-a_annotations.edf']);
    for (const f of files) {
      const edf = await openEdf(bytesSource(f.bytes), f.name);
      // Kemp & Olivan 2003 (EDF+), section 2.1.3: "EDF+C" in the reserved field; one "EDF Annotations" signal.
      expect(edf.header.format).toBe('EDF+C');
      expect(edf.dataSignals).toHaveLength(0);
      const mine = segs.filter((s) => s.subject === f.subject);
      const read = await edf.annotations();
      expect(read.map((a) => [a.onset, a.duration, a.text])).toEqual(mine.map((s) => [s.onset, s.duration, s.trialType]));
    }
    // S02's first window is an epoch time in the EDF date range: the header carries it (start 02.03.26 07.58.00).
    const s02 = await openEdf(bytesSource(files[1].bytes), files[1].name);
    expect(s02.startEpoch).toBe(T0);
    expect(new TextDecoder().decode(files[1].bytes.subarray(168, 184))).toBe('02.03.2607.58.00');
    // S01's times are relative (100 s): the recording field says the start date is unknown.
    expect(new TextDecoder().decode(files[0].bytes.subarray(88, 99))).toBe('Startdate X');
  });
});
