/**
 * The inner loops of the Map's rasterizer: one pass stamps a disc per point into the pixel buffer,
 * blending one constant alpha (or writing opaque colour when alpha is 1). Kept apart from the
 * Rasterizer's bookkeeping so the hot loops stay small and monomorphic; they allocate nothing.
 *
 * Blending is 8-bit fixed point on two lanes at once (red|blue and green), in int32 arithmetic:
 * out = (src·a + dst·(256 − a)) >> 8 per channel, with src·a precomputed per palette colour.
 * The 5-pixel "plus" stamp (radius 1: every Map above 200,000 points at dpr 1) is unrolled.
 */

/** Everything a pass needs, filled by the Rasterizer and reused between frames. */
export interface Pass {
  pixels: Uint32Array;
  width: number;
  height: number;
  /** Device-pixel transform: px = bx + a·x, py = by − a·y. */
  a: number;
  bx: number;
  by: number;
  coords: Float32Array;
  colourIndex: Uint8Array | Uint16Array;
  /** Stamp: pixel offsets as row-major deltas (dy·width + dx), and as interleaved dx, dy for clipping. */
  linear: Int32Array;
  offsets: Int16Array;
  /** Largest |dx| or |dy| of the stamp. */
  reach: number;
  /** Per palette index: premultiplied red|blue and green lanes (src·a), and the opaque colour. */
  rb: Int32Array;
  g: Int32Array;
  opaque: Uint32Array;
  /** 256 − a, in 1/256: 0 means opaque. */
  inv: number;
}

/** Counters of the first (full) pass: the points that touch the buffer and the distinct clusters among them. */
export interface PassCount {
  drawn: number;
  clusters: number;
  /** seen[label] = 1 once a cluster was counted; grown when a larger label comes up. */
  seen: Uint8Array;
}

/**
 * Blending one pixel is written out in full wherever it is needed (the engine does not reliably
 * inline a helper into these loops, and a call per pixel costs more than the blend):
 *   d = pixels[p];
 *   pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff)
 *                          | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
 * The lane sums stay below 2^32 (at most 255·256 per channel), so `| 0` then `>>> 8` is exact.
 */

/** True when the stamp is the 5-pixel plus (radius 1). */
function isPlus(s: Pass): boolean {
  return s.offsets.length === 10 && s.reach === 1;
}

/**
 * Stamps the points from..to−1, in order, and adds the points that touch the buffer and their
 * new clusters to `count` (`labels` in the same order; negative = none).
 */
export function passRange(s: Pass, from: number, to: number, labels: Int32Array, count: PassCount): void {
  if (isPlus(s) && s.inv !== 0) passRangePlus(s, from, to, labels, count);
  else passRangeAny(s, from, to, labels, count);
}

/** Stamps only the listed points (positions in drawing order, ascending), without counting. */
export function passSome(s: Pass, only: Int32Array): void {
  const { pixels, width: W, height: H, a, bx, by, coords, colourIndex, reach: R, linear: lin, inv, rb, g, opaque } = s;
  const m = lin.length;
  for (let j = 0; j < only.length; j++) {
    const i = only[j];
    const fx = bx + a * coords[2 * i], fy = by - a * coords[2 * i + 1];
    if (!(fx >= -R && fy >= -R && fx < W + R && fy < H + R)) continue;
    const px = ((fx + R + 1) | 0) - R - 1, py = ((fy + R + 1) | 0) - R - 1;
    const c = colourIndex[i];
    if (px >= R && py >= R && px < W - R && py < H - R) {
      const base = py * W + px;
      if (inv === 0) {
        const col = opaque[c];
        for (let k = 0; k < m; k++) pixels[base + lin[k]] = col;
        continue;
      }
      const srb = rb[c], sg = g[c];
      for (let k = 0; k < m; k++) {
        const p = base + lin[k], d = pixels[p];
        pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      }
    } else stampClipped(s, px, py, c);
  }
}

/** Any stamp and alpha. */
function passRangeAny(s: Pass, from: number, to: number, labels: Int32Array, count: PassCount): void {
  const { pixels, width: W, height: H, a, bx, by, coords, colourIndex, reach: R, linear: lin, inv, rb, g, opaque } = s;
  const m = lin.length;
  let seen = count.seen;
  let drawn = count.drawn, clusters = count.clusters;
  for (let i = from; i < to; i++) {
    const fx = bx + a * coords[2 * i], fy = by - a * coords[2 * i + 1];
    // Written so that NaN coordinates are skipped too.
    if (!(fx >= -R && fy >= -R && fx < W + R && fy < H + R)) continue;
    // floor() by truncating a positive number: fx + R + 1 > 0 here.
    const px = ((fx + R + 1) | 0) - R - 1, py = ((fy + R + 1) | 0) - R - 1;
    drawn++;
    const l = labels[i];
    if (l >= 0) {
      if (l >= seen.length) seen = grow(seen, l);
      if (seen[l] === 0) { seen[l] = 1; clusters++; }
    }
    const c = colourIndex[i];
    if (px >= R && py >= R && px < W - R && py < H - R) {
      const base = py * W + px;
      if (inv === 0) {
        const col = opaque[c];
        for (let k = 0; k < m; k++) pixels[base + lin[k]] = col;
        continue;
      }
      const srb = rb[c], sg = g[c];
      for (let k = 0; k < m; k++) {
        const p = base + lin[k], d = pixels[p];
        pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      }
    } else stampClipped(s, px, py, c);
  }
  count.seen = seen;
  count.drawn = drawn;
  count.clusters = clusters;
}

/** The 5-pixel plus, blended (reach 1): the million-point case, unrolled. */
function passRangePlus(s: Pass, from: number, to: number, labels: Int32Array, count: PassCount): void {
  const { pixels, width: W, height: H, a, bx, by, coords, colourIndex, inv, rb, g } = s;
  let seen = count.seen;
  let drawn = count.drawn, clusters = count.clusters;
  for (let i = from; i < to; i++) {
    const fx = bx + a * coords[2 * i], fy = by - a * coords[2 * i + 1];
    if (!(fx >= -1 && fy >= -1 && fx < W + 1 && fy < H + 1)) continue;
    const px = ((fx + 2) | 0) - 2, py = ((fy + 2) | 0) - 2;
    drawn++;
    const l = labels[i];
    if (l >= 0) {
      if (l >= seen.length) seen = grow(seen, l);
      if (seen[l] === 0) { seen[l] = 1; clusters++; }
    }
    const c = colourIndex[i];
    if (px >= 1 && py >= 1 && px < W - 1 && py < H - 1) {
      const srb = rb[c], sg = g[c];
      const base = py * W + px;
      let p = base - W, d = pixels[p];
      pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      p = base - 1; d = pixels[p];
      pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      p = base; d = pixels[p];
      pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      p = base + 1; d = pixels[p];
      pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
      p = base + W; d = pixels[p];
      pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
    } else stampClipped(s, px, py, c);
  }
  count.seen = seen;
  count.drawn = drawn;
  count.clusters = clusters;
}

/** One point near an edge: each pixel of the stamp is clipped. */
function stampClipped(s: Pass, px: number, py: number, c: number): void {
  const { pixels, width: W, height: H, offsets: off, inv } = s;
  const srb = s.rb[c], sg = s.g[c];
  for (let k = 0; k < off.length; k += 2) {
    const x = px + off[k], y = py + off[k + 1];
    if (x < 0 || y < 0 || x >= W || y >= H) continue;
    const p = y * W + x, d = pixels[p];
    pixels[p] = 0xff000000 | ((((srb + Math.imul(d & 0xff00ff, inv)) | 0) >>> 8) & 0xff00ff) | ((((sg + Math.imul(d & 0xff00, inv)) | 0) >>> 8) & 0xff00);
  }
}

function grow(seen: Uint8Array, label: number): Uint8Array {
  const next = new Uint8Array(Math.max(label + 1, 2 * seen.length));
  next.set(seen);
  return next;
}
