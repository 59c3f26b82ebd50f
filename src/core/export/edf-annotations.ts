import { civilFromEpoch, epochFromCivil, type CivilTime } from '../raw/civil-time';
import { writeEdf } from '../raw/edf/write';
import type { Segment } from './segments';

/** EDF dates run from 1985 to 2084 (Kemp et al. 1992; EDF+ clipping date rule, Kemp & Olivan 2003). */
const EDF_FIRST = epochFromCivil({ year: 1985, month: 1, day: 1, hour: 0, minute: 0, second: 0 });
const EDF_END = epochFromCivil({ year: 2085, month: 1, day: 1, hour: 0, minute: 0, second: 0 });

export interface EdfAnnotationFile {
  subject: string;
  session: string;
  /** Suggested file name: sub-<subject>[_ses-<session>]_annotations.edf (unsafe characters as "_"). */
  name: string;
  bytes: Uint8Array;
}

/**
 * One EDF+C file per subject and session holding only an "EDF Annotations" signal (no ordinary
 * signals, one data record of duration 0): each segment is a TAL "+onset 0x15 duration 0x14
 * trial type 0x14" (Kemp & Olivan 2003, section 2.2). When the windows' times are epoch seconds
 * within the EDF date range, the header's start date and time are the first window's (UTC) and the
 * onsets are seconds after it; otherwise the start date is written as unknown ("Startdate X").
 */
export function edfAnnotationFiles(segments: readonly Segment[]): EdfAnnotationFile[] {
  const groups = new Map<string, Segment[]>();
  for (const s of segments) {
    const key = JSON.stringify([s.subject, s.session]);
    const g = groups.get(key);
    if (g) g.push(s);
    else groups.set(key, [s]);
  }
  return [...groups.values()].map((g) => {
    const { subject, session, origin } = g[0];
    return {
      subject, session,
      name: `sub-${safe(subject) || 'X'}${session ? `_ses-${safe(session)}` : ''}_annotations.edf`,
      bytes: edfAnnotations(subject, origin, g.map((s) => ({ onset: s.onset, duration: s.duration, text: s.trialType }))),
    };
  });
}

/** An EDF+C annotation-only file for one subject; `origin` is the time the onsets count from. */
export function edfAnnotations(subject: string, origin: number, annotations: { onset: number; duration: number; text: string }[]): Uint8Array {
  const known = origin >= EDF_FIRST && origin < EDF_END;
  const start: CivilTime = known ? civilFromEpoch(origin) : { year: 1985, month: 1, day: 1, hour: 0, minute: 0, second: 0 };
  const code = headerText(subject) || 'X';
  return writeEdf({
    patient: `${code} X X X`,
    recording: known ? 'Gleaner weak labels' : 'Startdate X X X X Gleaner weak labels (times relative to the first window)',
    start,
    recordDuration: 0,
    signals: [],
    annotations: annotations.map((a) => ({ onset: a.onset, duration: a.duration, text: printable(a.text) })),
    plus: true,
  });
}

/** Control characters (bytes 0x00–0x1f, which TALs reserve for their own marks) as spaces. */
function printable(s: string): string {
  return Array.from(s, (ch) => (ch.charCodeAt(0) < 0x20 ? ' ' : ch)).join('');
}

/** Printable ASCII without spaces, for EDF header subfields. */
function headerText(s: string): string {
  return s.replace(/[^\x21-\x7e]/g, '_').slice(0, 60);
}

/** Letters and digits only, as BIDS entity labels (BIDS "Common principles": label = alphanumeric). */
function safe(s: string): string {
  return s.replace(/[^A-Za-z0-9]/g, '');
}
