/**
 * The Map as a figure for exports: SVG (one compact path per colour, each point a tiny square
 * drawn with relative moves) and PNG (drawn on an offscreen 2-D canvas). Large maps are sampled
 * with a fixed stride, and the figure says so.
 */

/** Points drawn in an SVG figure at most; larger maps are sampled (the caption says so). */
export const SVG_MAX_POINTS = 20000;

export interface MapFigureInput {
  /** Interleaved x, y per window. */
  coords: Float32Array;
  /** Cluster per window (negative: not drawn). */
  labels: Int32Array;
  /** Colour per cluster ("#rrggbb"). */
  colours: string[];
  /** Legend entries: cluster index → name (live clusters only). */
  legend: { cluster: number; name: string }[];
  width?: number;
  height?: number;
}

interface Layout {
  width: number;
  height: number;
  plotW: number;
  toX: (x: number) => number;
  toY: (y: number) => number;
}

const LEGEND_W = 190;
const PAD = 16;

function layout(coords: Float32Array, width: number, height: number, legendW: number): Layout {
  let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
  for (let i = 0; i < coords.length; i += 2) {
    const x = coords[i], y = coords[i + 1];
    if (x < x0) x0 = x;
    if (x > x1) x1 = x;
    if (y < y0) y0 = y;
    if (y > y1) y1 = y;
  }
  const plotW = width - legendW - 2 * PAD, plotH = height - 2 * PAD;
  const s = Math.min(plotW / (x1 - x0 || 1), plotH / (y1 - y0 || 1));
  const ox = PAD + (plotW - s * (x1 - x0)) / 2, oy = PAD + (plotH - s * (y1 - y0)) / 2;
  return { width, height, plotW, toX: (x) => ox + s * (x - x0), toY: (y) => height - (oy + s * (y - y0)) };
}

function esc(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** The Map as an SVG document, and how many points it shows out of how many. */
export function mapSvg(input: MapFigureInput): { svg: string; shown: number; total: number } {
  const { coords, labels, colours, legend } = input;
  const width = input.width ?? 900, height = input.height ?? 640;
  const L = layout(coords, width, height, LEGEND_W);
  const n = labels.length;
  const stride = Math.max(1, Math.ceil(n / SVG_MAX_POINTS));
  const paths = new Map<number, string[]>();
  let shown = 0;
  for (let i = 0; i < n; i += stride) {
    const c = labels[i];
    if (c < 0) continue;
    const x = L.toX(coords[2 * i]).toFixed(1), y = L.toY(coords[2 * i + 1]).toFixed(1);
    let parts = paths.get(c);
    if (!parts) paths.set(c, (parts = []));
    parts.push(`M${x} ${y}h2v2h-2z`);
    shown++;
  }
  const body = [...paths.entries()].map(([c, parts]) => `<path fill="${colours[c] ?? '#888888'}" stroke="none" d="${parts.join('')}"/>`).join('\n');
  const lx = width - LEGEND_W;
  const items = legend.map((e, j) => `<rect x="${lx}" y="${PAD + 18 * j}" width="12" height="12" fill="${colours[e.cluster] ?? '#888888'}"/><text x="${lx + 18}" y="${PAD + 18 * j + 11}">${esc(e.name)}</text>`).join('\n');
  const note = stride > 1 ? `<text x="${PAD}" y="${height - 4}" class="note">${shown} of ${n} windows shown (every ${stride}th)</text>` : '';
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="12">
<rect width="${width}" height="${height}" fill="#ffffff"/>
${body}
${items}
${note}
</svg>`;
  return { svg, shown, total: n };
}

/** The Map as PNG bytes, every window drawn. */
export async function mapPng(input: MapFigureInput): Promise<Uint8Array> {
  const width = input.width ?? 1800, height = input.height ?? 1280;
  const L = layout(input.coords, width, height, 380);
  const canvas = new OffscreenCanvas(width, height);
  const g = canvas.getContext('2d');
  if (!g) throw new Error('the Map figure could not be drawn (no 2-D canvas)');
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, width, height);
  const { coords, labels, colours } = input;
  for (let i = 0; i < labels.length; i++) {
    const c = labels[i];
    if (c < 0) continue;
    g.fillStyle = colours[c] ?? '#888888';
    g.fillRect(L.toX(coords[2 * i]) - 1.5, L.toY(coords[2 * i + 1]) - 1.5, 3, 3);
  }
  g.font = '22px sans-serif';
  input.legend.forEach((e, j) => {
    g.fillStyle = colours[e.cluster] ?? '#888888';
    g.fillRect(width - 360, 30 + 32 * j, 20, 20);
    g.fillStyle = '#1d232b';
    g.fillText(e.name, width - 330, 47 + 32 * j);
  });
  const blob = await canvas.convertToBlob({ type: 'image/png' });
  return new Uint8Array(await blob.arrayBuffer());
}
