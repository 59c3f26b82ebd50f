const CANDIDATES = [',', ';', '\t'] as const;
export type Delimiter = (typeof CANDIDATES)[number];

/** Splits a sample into lines (LF or CRLF), dropping the last one when the sample is cut mid-line. */
function sampleLines(sample: string, complete: boolean): string[] {
  const lines = sample.split(/\r?\n/);
  if (!complete) lines.pop();
  return lines.filter((l) => l.trim() !== '').slice(0, 100);
}

/** Occurrences of `ch` outside double quotes. */
function countOutsideQuotes(line: string, ch: string): number {
  let n = 0;
  let quoted = false;
  for (const c of line) {
    if (c === '"') quoted = !quoted;
    else if (c === ch && !quoted) n++;
  }
  return n;
}

/**
 * Guesses the delimiter from the first lines: the candidate (comma, semicolon, tab) that appears
 * in the header and splits the most lines into as many fields as the header, ties going to the
 * one that splits the header into more fields. Comma when nothing fits. Common practice.
 */
export function sniffDelimiter(sample: string, complete: boolean): Delimiter {
  const lines = sampleLines(sample, complete);
  if (lines.length === 0) return ',';
  let best: Delimiter = ',';
  let bestScore = -1;
  let bestCount = 0;
  for (const d of CANDIDATES) {
    const head = countOutsideQuotes(lines[0], d);
    if (head === 0) continue;
    let consistent = 0;
    for (const l of lines) if (countOutsideQuotes(l, d) === head) consistent++;
    const score = consistent / lines.length;
    if (score > bestScore || (score === bestScore && head > bestCount)) {
      best = d;
      bestScore = score;
      bestCount = head;
    }
  }
  return best;
}

const COMMA_DECIMAL = /^[+-]?\d+,\d+(?:[eE][+-]?\d+)?$/;
const DOT_DECIMAL = /^[+-]?\d*\.\d+(?:[eE][+-]?\d+)?$/;

/**
 * A file whose delimiter is not a comma uses a decimal comma when its data cells hold numbers
 * like 0,25 and none like 0.25 (the habit of locales that write a decimal comma). Common practice.
 */
export function sniffDecimal(sample: string, complete: boolean, delimiter: Delimiter): '.' | ',' {
  if (delimiter === ',') return '.';
  let comma = 0;
  let dot = 0;
  for (const line of sampleLines(sample, complete).slice(1)) {
    for (const raw of line.split(delimiter)) {
      const cell = raw.trim().replace(/^"|"$/g, '');
      if (COMMA_DECIMAL.test(cell)) comma++;
      else if (DOT_DECIMAL.test(cell)) dot++;
    }
  }
  return comma > 0 && dot === 0 ? ',' : '.';
}
