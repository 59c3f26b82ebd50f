import { hashBlob } from '../core/hash/blob-hash';

// Entry of the hashing worker the app's job worker starts for each file it parses: SHA-256 of the
// posted Blob, read in slices, posted back as { hex } or { error }.
interface HashScope {
  postMessage(message: { hex?: string; error?: string }): void;
  onmessage: ((event: MessageEvent<{ blob: Blob }>) => void) | null;
}
const scope = self as unknown as HashScope;
scope.onmessage = (event) => {
  hashBlob(event.data.blob).then(
    (hex) => scope.postMessage({ hex }),
    (e: unknown) => scope.postMessage({ error: e instanceof Error ? e.message : String(e) }),
  );
};
