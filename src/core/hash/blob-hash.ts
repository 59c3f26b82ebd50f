import { blobSource, type SliceableBlob } from '../raw/byte-source';
import { createSha256 } from './sha256';

/** A hash being computed elsewhere (another thread): its hex digest, or stop it. */
export interface RunningBlobHash {
  readonly digest: Promise<string>;
  stop(): void;
}

/** Starts hashing a Blob off the parsing thread; null where no such thread can be started. */
export type BlobHasher = (blob: Blob) => RunningBlobHash | null;

/** Bytes read at a time. */
const SLICE = 4 << 20;

/** SHA-256 of a Blob read in slices on the calling thread (what the hashing worker runs). */
export async function hashBlob(blob: SliceableBlob): Promise<string> {
  const source = blobSource(blob);
  const hash = createSha256();
  for (let at = 0; at < source.size; at += SLICE) hash.update(await source.read(at, Math.min(SLICE, source.size - at)));
  return hash.hex();
}
