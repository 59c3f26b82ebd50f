import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { bytesSource } from '../../../src/core/raw/byte-source';
import { openEdf } from '../../../src/core/raw/edf/read';
import { writeEdf } from '../../../src/core/raw/edf/write';
import { epochFromCivil } from '../../../src/core/raw/civil-time';
import { linkWindows, parseManifest, rawPathFor, type LinkWindow } from '../../../src/core/raw/link';
import type { RawSource } from '../../../src/core/raw/span.types';

const START = { year: 2026, month: 3, day: 2, hour: 8, minute: 0, second: 0 };
const T0 = epochFromCivil(START);

/** 60 s recorded, then a gap, then 60 s from 120 s (EDF+D, 1 Hz). */
async function gappedSource(): Promise<RawSource> {
  const samples = Float64Array.from({ length: 120 }, (_, i) => i);
  const onsets = Array.from({ length: 120 }, (_, i) => (i < 60 ? i : i + 60));
  return openEdf(bytesSource(writeEdf({
    patient: 'S01', recording: '', start: START, recordDuration: 1, plus: true, recordOnsets: onsets,
    signals: [{ label: 'x', unit: 'g', physMin: -1000, physMax: 1000, digMin: -32768, digMax: 32767, samplesPerRecord: 1, samples }],
  })), 'S01.edf');
}

describe('rawPathFor', () => {
  it('fills {subject} and {session} in a file pattern', () => {
    expect(rawPathFor({ pattern: 'raw/{subject}/{session}.edf' }, 'S01', 'day1')).toEqual({ path: 'raw/S01/day1.edf', offset: 0 });
    expect(rawPathFor({ pattern: 'raw/{subject}_{session}.edf' }, 'S01')).toEqual({ message: expect.stringMatching(/needs a session/) });
  });

  it('looks subjects and sessions up in a manifest, session-specific rows first', () => {
    const manifest = parseManifest(new TextEncoder().encode('subject,session,path,offset\nS01,,all.edf,0\nS01,b,b.csv,-2.5\n'), 'm.csv');
    expect(rawPathFor({ manifest }, 'S01', 'b')).toEqual({ path: 'b.csv', offset: -2.5 });
    expect(rawPathFor({ manifest }, 'S01', 'a')).toEqual({ path: 'all.edf', offset: 0 });
    expect(rawPathFor({ manifest }, 'S02')).toEqual({ message: 'the manifest lists no raw file for subject S02' });
  });

  it('rejects a manifest without a path column or with a bad offset, naming row and column', () => {
    const bad = (s: string) => () => parseManifest(new TextEncoder().encode(s), 'm.csv');
    expect(bad('subject,file\nS01,a.edf\n')).toThrow(InputError);
    expect(bad('subject,file\nS01,a.edf\n')).toThrow(/m\.csv, row 1: expected a "path" column/);
    expect(bad('subject,path,offset\nS01,a.edf,1\nS02,b.edf,soon\n')).toThrow(/row 3, column "offset": expected seconds/);
  });
});

describe('linkWindows', () => {
  it('maps window start and end to file time, and says why a window cannot be shown', async () => {
    const source = await gappedSource();
    const windows: LinkWindow[] = [
      { id: 'S01-1', subject: 'S01', start: T0 + 10, end: T0 + 15 },
      { id: 'S01-2', subject: 'S01', start: T0 + 125, end: T0 + 130 },
      { id: 'S01-3', subject: 'S01', start: T0 + 70, end: T0 + 75 },
      { id: 'S01-4', subject: 'S01', start: T0 + 400, end: T0 + 405 },
      { id: 'S01-5', subject: 'S01', start: T0 + 178, end: T0 + 183 },
      { id: 'S02-1', subject: 'S02', start: T0, end: T0 + 5 },
    ];
    const opened: string[] = [];
    const links = await linkWindows(windows, { pattern: 'raw/{subject}.edf' }, async (p) => {
      opened.push(p);
      return p === 'raw/S01.edf' ? source : null;
    });
    expect(opened).toEqual(['raw/S01.edf', 'raw/S02.edf']); // each file opened once
    expect(links[0]).toMatchObject({ ok: true, start: 10, end: 15 });
    expect(links[1]).toMatchObject({ ok: true, start: 125, end: 130 });
    expect(links.slice(2).map((l) => (l.ok ? 'ok' : l.message))).toEqual([
      'window S01-3 (2026-03-02T08:01:10Z to 2026-03-02T08:01:15Z) falls partly or wholly in a gap of the recording (no samples there) in raw/S01.edf',
      'window S01-4 (2026-03-02T08:06:40Z to 2026-03-02T08:06:45Z) is outside its recording, which covers 2026-03-02T08:00:00Z to 2026-03-02T08:03:00Z in raw/S01.edf',
      'window S01-5 (2026-03-02T08:02:58Z to 2026-03-02T08:03:03Z) runs past the edge of its recording, which covers 2026-03-02T08:00:00Z to 2026-03-02T08:03:00Z in raw/S01.edf',
      'window S02-1 (subject S02): raw file raw/S02.edf not found',
    ]);
  });

  it('applies a manifest offset and reads the linked span', async () => {
    const source = await gappedSource();
    const [link] = await linkWindows([{ id: 'w', subject: 'S01', start: T0 + 3, end: T0 + 5 }], { manifest: [{ subject: 'S01', path: 'S01.edf', offset: 2 }] }, async () => source);
    expect(link).toMatchObject({ ok: true, start: 5, end: 7 });
    if (!link.ok) throw new Error(link.message);
    expect(Array.from((await link.source.readSpan(link.start, link.end)).channels[0].samples.map((v) => Math.round(v)))).toEqual([5, 6]);
  });
});
