import { formatNumber } from './csv';
import type { Segment } from './segments';

export const EVENTS_TSV_HEADER = ['onset', 'duration', 'trial_type', 'subject', 'session', 'cluster', 'class_name', 'n_windows', 'mean_confidence', 'origin'];

/** Digits for times: enough for epoch seconds with microseconds. */
const TIME_DIGITS = 16;

/**
 * Event segments as a BIDS events file (BIDS specification, "Modality agnostic files" → "Task
 * events", and "Common principles" → tabular files): tab-separated with a header row; onset and
 * duration in seconds first, then trial_type, then our columns; "n/a" for every missing value; no
 * quoting, so a tab or line break inside a value is written as a space. Onsets are measured from
 * the first window of the same subject and session (`origin`, in the table's time).
 */
export function eventsTsv(segments: readonly Segment[]): string {
  const lines = [EVENTS_TSV_HEADER.join('\t')];
  for (const s of segments) {
    lines.push([
      time(s.onset),
      time(s.duration),
      text(s.trialType),
      text(s.subject),
      text(s.session),
      String(s.cluster),
      text(s.className),
      String(s.windows),
      formatNumber(s.meanConfidence, 4) || 'n/a',
      time(s.origin),
    ].join('\t'));
  }
  return `${lines.join('\n')}\n`;
}

function time(v: number): string {
  return formatNumber(v, TIME_DIGITS) || 'n/a';
}

function text(v: string): string {
  const clean = v.replace(/[\t\r\n]/g, ' ');
  return clean === '' ? 'n/a' : clean;
}
