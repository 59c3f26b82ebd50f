/**
 * Category colours for the Map and the cluster list: Okabe & Ito's colour-blind-safe set first
 * (Okabe & Ito 2008, "Color Universal Design"), ordered so that the colours easiest to see on a
 * light background come first, then ColorBrewer's qualitative sets (Brewer, colorbrewer2.org):
 * the Dark2 colours that differ clearly from the Okabe–Ito ones (its teal, orange and mustard are
 * near-twins of Okabe–Ito colours and are left out), then Set2. Beyond the 21 colours the cycle
 * repeats.
 */
const OKABE_ITO = ['#0072B2', '#E69F00', '#009E73', '#D55E00', '#CC79A7', '#56B4E9', '#F0E442', '#000000'];
const DARK2_DISTINCT = ['#7570b3', '#e7298a', '#66a61e', '#a6761d', '#666666'];
const SET2 = ['#66c2a5', '#fc8d62', '#8da0cb', '#e78ac3', '#a6d854', '#ffd92f', '#e5c494', '#b3b3b3'];

export const CATEGORY_COLOURS: readonly string[] = [...OKABE_ITO, ...DARK2_DISTINCT, ...SET2];

/** The colour of category `i` (0-based). */
export function categoryColour(i: number): string {
  const n = CATEGORY_COLOURS.length;
  return CATEGORY_COLOURS[((i % n) + n) % n];
}

/**
 * Viridis for continuous values (feature values, time): matplotlib's viridis colormap
 * (lib/matplotlib/_cm_listed.py `_viridis_data`, from BIDS/colormap option_d.py by van der Walt,
 * Smith and Firing), every 16th of its 256 entries (0, 16, …, 240, 255), interpolated linearly.
 */
const VIRIDIS_STOPS = [
  '#440154', '#48186a', '#472d7b', '#424086', '#3b528b', '#33638d', '#2c728e', '#26828e', '#21918c',
  '#1fa088', '#28ae80', '#3fbc73', '#5ec962', '#84d44b', '#addc30', '#d8e219', '#fde725',
];
const STOP_AT = VIRIDIS_STOPS.map((_, i) => (i === VIRIDIS_STOPS.length - 1 ? 1 : (16 * i) / 255));
const STOP_RGB = VIRIDIS_STOPS.map((h) => [1, 3, 5].map((o) => parseInt(h.slice(o, o + 2), 16)));

/** Viridis at t in [0, 1] (clamped) as 8-bit [r, g, b]. */
export function viridis(t: number): [number, number, number] {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  let j = 1;
  while (j < STOP_AT.length - 1 && STOP_AT[j] < x) j++;
  const f = (x - STOP_AT[j - 1]) / (STOP_AT[j] - STOP_AT[j - 1]);
  const a = STOP_RGB[j - 1], b = STOP_RGB[j];
  return [0, 1, 2].map((c) => Math.round(a[c] + (b[c] - a[c]) * f)) as [number, number, number];
}

/** '#rrggbb' of an 8-bit colour. */
export function hexOf([r, g, b]: readonly number[]): string {
  return `#${[r, g, b].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

/** Points with no value (missing label, feature or time) are drawn light grey. */
export const MISSING_COLOUR = '#cfd3d8';

/**
 * Colours for the values of a column (subjects, labels, metadata) and for signal channels, so that
 * no colour on a screen means both a cluster and something else: discrete viridis (the sequential
 * map above, sampled at golden-ratio steps so that neighbouring codes differ; common practice for a
 * categorical use of a sequential map), kept away from its darkest and lightest ends. None of them
 * is a cluster colour (checked in test/app/palette.test.ts).
 */
export const VALUE_COLOURS: readonly string[] = Array.from({ length: 16 }, (_, i) => hexOf(viridis(0.06 + 0.86 * ((i * 0.6180339887498949) % 1))));

/** The colour of value `i` (0-based) of a column, or of signal channel `i`. */
export function valueColour(i: number): string {
  const n = VALUE_COLOURS.length;
  return VALUE_COLOURS[((i % n) + n) % n];
}

/** WCAG 2.x relative luminance of '#rrggbb' (sRGB, linearized). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((o) => {
    const c = parseInt(hex.slice(o, o + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.x contrast ratio of two colours, 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const [l1, l2] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (l1 + 0.05) / (l2 + 0.05);
}

/** Black or white text on a background, whichever contrasts more (either passes AA, 4.5:1, on every palette colour here). */
export function textColourOn(background: string): '#000000' | '#ffffff' {
  return contrastRatio('#000000', background) >= contrastRatio('#ffffff', background) ? '#000000' : '#ffffff';
}
