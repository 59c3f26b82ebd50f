/**
 * Placed windows (positioned from their sampled neighbours, not embedded) are drawn lighter:
 * the palette is doubled with each colour mixed 55 % towards white, and a placed point uses the
 * lighter copy of its colour.
 */

/** Share of white mixed into a placed point's colour. */
export const PLACED_LIGHTEN = 0.55;

/** The palette followed by its lighter copies (packed 0xAABBGGRR). */
export function withPlacedColours(palette: Uint32Array): Uint32Array {
  const out = new Uint32Array(2 * palette.length);
  out.set(palette);
  for (let c = 0; c < palette.length; c++) {
    const v = palette[c];
    const mix = (ch: number) => Math.round(ch + (255 - ch) * PLACED_LIGHTEN);
    const r = mix(v & 255), g = mix((v >>> 8) & 255), b = mix((v >>> 16) & 255);
    out[palette.length + c] = ((v & 0xff000000) | (b << 16) | (g << 8) | r) >>> 0;
  }
  return out;
}

/** Colour index per point with placed points moved to the lighter half of the doubled palette. */
export function placedIndex(index: Uint8Array, placed: Uint8Array, paletteSize: number, out: Uint16Array): Uint16Array {
  for (let i = 0; i < index.length; i++) out[i] = placed[i] ? index[i] + paletteSize : index[i];
  return out;
}
