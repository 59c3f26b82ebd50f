import { toScreen, type MapView } from './view';

export interface MapLayer {
  coords: Float32Array;
  /** Colour index per point (into `colours`). */
  colourOf: Int32Array;
  colours: readonly string[];
  /** Cluster per point, to count the clusters actually drawn. */
  labels: Int32Array;
  /** 1 = selected; null or a zero count = no selection (everything at full strength). */
  selection: Uint8Array | null;
  selectionCount: number;
}

export interface DrawStats {
  pointsDrawn: number;
  clustersDrawn: number;
}

const RADIUS = 2.6;
const SELECTED_RADIUS = 3.4;

/**
 * Draws the points on a 2-D canvas, one path per colour (not one call per point). With a
 * selection, unselected points are dimmed and drawn first, selected ones on top with a dark halo.
 */
export function drawMap(ctx: CanvasRenderingContext2D, view: MapView, dpr: number, layer: MapLayer): DrawStats {
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, view.width, view.height);
  const n = layer.coords.length / 2;
  const hasSelection = layer.selection !== null && layer.selectionCount > 0;
  const visible = new Uint8Array(n);
  const sx = new Float32Array(n);
  const sy = new Float32Array(n);
  let pointsDrawn = 0;
  const seen = new Set<number>();
  for (let i = 0; i < n; i++) {
    const [x, y] = toScreen(view, layer.coords[2 * i], layer.coords[2 * i + 1]);
    if (x < -4 || y < -4 || x > view.width + 4 || y > view.height + 4) continue;
    visible[i] = 1;
    sx[i] = x;
    sy[i] = y;
    pointsDrawn++;
    seen.add(layer.labels[i]);
  }
  const pass = (wantSelected: boolean, radius: number, alpha: number, mode: 'fill' | 'halo'): void => {
    ctx.globalAlpha = alpha;
    for (let c = 0; c < layer.colours.length; c++) {
      ctx.beginPath();
      let any = false;
      for (let i = 0; i < n; i++) {
        if (!visible[i] || layer.colourOf[i] !== c) continue;
        if (hasSelection && (layer.selection![i] === 1) !== wantSelected) continue;
        ctx.moveTo(sx[i] + radius, sy[i]);
        ctx.arc(sx[i], sy[i], radius, 0, 2 * Math.PI);
        any = true;
      }
      if (!any) continue;
      ctx.fillStyle = mode === 'halo' ? '#1d232b' : layer.colours[c];
      ctx.fill();
    }
  };
  if (hasSelection) {
    // Dimmed context, then the selection: a dark halo under every selected point, then its colour.
    pass(false, RADIUS, 0.14, 'fill');
    pass(true, SELECTED_RADIUS + 1, 0.9, 'halo');
    pass(true, SELECTED_RADIUS, 1, 'fill');
  } else {
    pass(true, RADIUS, 0.8, 'fill');
  }
  ctx.globalAlpha = 1;
  return { pointsDrawn, clustersDrawn: seen.size };
}
