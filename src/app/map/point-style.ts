import { packHex, type RasterStyle } from './raster';

/**
 * How big and how opaque the Map's points are, from the number of windows and the device pixel
 * ratio. A small study gets discs of about 5 CSS px at 80 % opacity, so each window reads on its
 * own; a large one gets smaller, fainter discs, so dense regions build up colour (where points
 * overlap, alpha accumulates: a density cue) instead of a flat blot.
 */
export function pointStyle(n: number, dpr: number, palette: Uint32Array): RasterStyle {
  const d = Math.max(1, dpr);
  const css = n <= 20_000 ? 2.6 : n <= 200_000 ? 1.5 : 1;
  const alpha = Math.min(0.8, Math.max(0.35, 2 * Math.sqrt(20_000 / Math.max(1, n))));
  const radius = css * d;
  return {
    palette,
    radius,
    selectedRadius: radius + 0.8 * d,
    alpha,
    dimmedAlpha: n <= 20_000 ? 0.14 : 0.08,
    outline: packHex('#1d232b'),
  };
}

/** Background of the Map (the stage is white). */
export const BACKGROUND = packHex('#ffffff');
