/** SHA-256 of some bytes as lowercase hex (Web Crypto; runs off the UI thread). */
export async function sha256Hex(bytes: Uint8Array): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', bytes as Uint8Array<ArrayBuffer>);
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** A copy of `bytes` in a buffer of its own, safe to transfer to the worker. */
export function ownBuffer(bytes: Uint8Array): Uint8Array<ArrayBuffer> {
  return bytes.slice();
}
