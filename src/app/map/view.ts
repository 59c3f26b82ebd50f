/**
 * The Map's data → screen transform. The data bounds are fitted into the canvas (CSS pixels) with
 * a margin; the user's zoom multiplies that scale and pan shifts the centre. Screen y grows down,
 * data y grows up.
 */
export interface MapView {
  /** Canvas size in CSS pixels. */
  width: number;
  height: number;
  /** Data point shown at the canvas centre. */
  centreX: number;
  centreY: number;
  /** CSS pixels per data unit. */
  scale: number;
}

export function fitView(coords: Float32Array, width: number, height: number, margin = 24): MapView {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < coords.length; i += 2) {
    minX = Math.min(minX, coords[i]); maxX = Math.max(maxX, coords[i]);
    minY = Math.min(minY, coords[i + 1]); maxY = Math.max(maxY, coords[i + 1]);
  }
  if (!Number.isFinite(minX)) { minX = minY = -1; maxX = maxY = 1; }
  const spanX = Math.max(maxX - minX, 1e-9), spanY = Math.max(maxY - minY, 1e-9);
  const scale = Math.min((width - 2 * margin) / spanX, (height - 2 * margin) / spanY);
  return { width, height, centreX: (minX + maxX) / 2, centreY: (minY + maxY) / 2, scale: Math.max(scale, 1e-9) };
}

export function toScreen(v: MapView, x: number, y: number): [number, number] {
  return [v.width / 2 + (x - v.centreX) * v.scale, v.height / 2 - (y - v.centreY) * v.scale];
}

export function toData(v: MapView, sx: number, sy: number): [number, number] {
  return [v.centreX + (sx - v.width / 2) / v.scale, v.centreY - (sy - v.height / 2) / v.scale];
}

/** Zooms by `factor` keeping the data point under screen position (sx, sy) in place. */
export function zoomAt(v: MapView, sx: number, sy: number, factor: number): MapView {
  const [dx, dy] = toData(v, sx, sy);
  const scale = v.scale * factor;
  return {
    ...v,
    scale,
    centreX: dx - (sx - v.width / 2) / scale,
    centreY: dy + (sy - v.height / 2) / scale,
  };
}

/** Moves the view by a screen-space drag of (dx, dy) CSS pixels. */
export function panBy(v: MapView, dx: number, dy: number): MapView {
  return { ...v, centreX: v.centreX - dx / v.scale, centreY: v.centreY + dy / v.scale };
}
