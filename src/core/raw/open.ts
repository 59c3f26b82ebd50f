import type { ByteSource } from './byte-source';
import { openRawCsv } from './csv/read';
import { openEdf } from './edf/read';
import type { RawSource } from './span.types';

/** True when the bytes start like an EDF header (version field "0" and seven spaces). */
export function looksLikeEdf(head: Uint8Array): boolean {
  return head.length >= 8 && head[0] === 0x30 && head.subarray(1, 8).every((b) => b === 0x20);
}

/** Opens a raw-signal file by its content: EDF/EDF+ or an indexed CSV. */
export async function openRawSource(source: ByteSource, fileName: string): Promise<RawSource> {
  const head = await source.read(0, 8);
  return looksLikeEdf(head) ? openEdf(source, fileName) : openRawCsv(source, fileName);
}
