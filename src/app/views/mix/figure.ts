import { textColourOn, valueColour } from '../../lib/palette';
import type { MixBar } from './mix-bars';

/** What the Mix figure needs: the bars as drawn, and cluster names and colours (curated). */
export interface MixFigureInput {
  bars: MixBar[];
  column: string;
  name: (cluster: number) => string;
  colour: (cluster: number) => string;
  width?: number;
}

const LABEL_W = 230, ROW_H = 24, GAP = 8, PAD = 16, TITLE_H = 26, NOTE_H = 18;

function esc(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Height of the Mix figure for `bars` rows. */
export function mixFigureHeight(bars: number): number {
  return PAD + TITLE_H + bars * (ROW_H + GAP) + NOTE_H + PAD;
}

/**
 * The Mix as a stand-alone SVG document: one bar per cluster (the view's order), its segments the
 * values of `column`, labelled where they are wide enough, and a ⚑ after bound clusters.
 */
export function mixSvg(input: MixFigureInput): { svg: string; width: number; height: number } {
  const width = input.width ?? 900;
  const height = mixFigureHeight(input.bars.length);
  const barW = width - LABEL_W - 2 * PAD;
  const rows = input.bars.map((b, r) => {
    const y = PAD + TITLE_H + r * (ROW_H + GAP);
    const segs = b.segments.map((s) => {
      const x = PAD + LABEL_W + s.start * barW, w = Math.max(0.5, s.share * barW);
      const fill = valueColour(s.code);
      const label = w > 40 ? `<text x="${(x + 4).toFixed(1)}" y="${y + 16}" font-size="11" fill="${textColourOn(fill)}">${esc(s.value === '' ? '(missing)' : s.value)}</text>` : '';
      return `<rect x="${x.toFixed(1)}" y="${y}" width="${w.toFixed(1)}" height="${ROW_H}" fill="${fill}" stroke="#ffffff"/>${label}`;
    }).join('');
    const name = `${input.name(b.cluster)}${b.bound ? ' ⚑' : ''}`;
    return `<rect x="${PAD}" y="${y + 6}" width="12" height="12" rx="2" fill="${input.colour(b.cluster)}"/>`
      + `<text x="${PAD + 18}" y="${y + 16}">${esc(name)}</text>`
      + `<text x="${PAD + LABEL_W - 8}" y="${y + 16}" text-anchor="end" fill="#555555">${b.size}</text>${segs}`;
  }).join('\n');
  const title = `Mix: clusters by ${input.column || 'value'} (segments: share of the cluster's windows)`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="12">
<rect width="${width}" height="${height}" fill="#ffffff"/>
<text x="${PAD}" y="${PAD + 12}" font-size="13" font-weight="bold">${esc(title)}</text>
${rows}
<text x="${PAD}" y="${height - PAD}" fill="#555555">${esc(`Left: cluster and its windows. ⚑ bound to a few values of ${input.column || 'the column'}.`)}</text>
</svg>`;
  return { svg, width, height };
}
