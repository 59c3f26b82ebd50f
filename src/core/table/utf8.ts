import { InputError } from '../errors';

/**
 * Decodes UTF-8 bytes to text, dropping a leading byte-order mark. Bytes that are not valid UTF-8
 * raise an InputError naming the line where the first bad byte sits.
 */
export function decodeUtf8(bytes: Uint8Array, fileName: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    const at = firstInvalidByte(bytes);
    let line = 1;
    for (let i = 0; i < at; i++) if (bytes[i] === 0x0a) line++;
    throw new InputError({
      file: fileName,
      row: line,
      expected: 'UTF-8 text (save the file as UTF-8)',
      found: `byte 0x${bytes[at].toString(16).padStart(2, '0')} at offset ${at}`,
    });
  }
}

/** Offset of the first byte that breaks UTF-8 well-formedness (bytes.length when none). */
function firstInvalidByte(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i];
    let extra: number;
    let min: number;
    if (c < 0x80) { i++; continue; }
    else if (c >= 0xc2 && c <= 0xdf) { extra = 1; min = 0x80; }
    else if (c >= 0xe0 && c <= 0xef) { extra = 2; min = 0x800; }
    else if (c >= 0xf0 && c <= 0xf4) { extra = 3; min = 0x10000; }
    else return i;
    if (i + extra >= b.length) return i;
    let cp = c & (0x3f >> extra);
    for (let k = 1; k <= extra; k++) {
      const cc = b[i + k];
      if ((cc & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (cc & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += extra + 1;
  }
  return Math.min(i, b.length - 1);
}
