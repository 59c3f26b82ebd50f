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
