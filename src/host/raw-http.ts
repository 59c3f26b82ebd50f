import type { ByteSource } from '../core/raw/byte-source';
import { blockCached } from './block-cache';
import type { RawFolder } from './raw-folder';
import { baseName } from './raw-folder';

/** Bytes fetched with the first request of a file: enough for an EDF header of a few channels. */
const HEAD_BYTES = 4096;

/** The total size in a Content-Range header ("bytes 0-4095/1337886"), or null. */
export function totalFromContentRange(header: string | null): number | null {
  const m = header ? /^bytes (?:\d+-\d+|\*)\/(\d+)$/.exec(header.trim()) : null;
  return m ? Number(m[1]) : null;
}

/**
 * A ByteSource over HTTP Range requests (the demo's raw files served beside the app). Null when
 * the server answers 404; an error when it ignores ranges or fails otherwise.
 */
export async function httpRangeSource(url: URL, fetchFn: typeof fetch = fetch): Promise<ByteSource | null> {
  const first = await fetchFn(url, { headers: { range: `bytes=0-${HEAD_BYTES - 1}` } });
  if (first.status === 404) return null;
  if (first.status === 416) return { size: 0, read: () => Promise.resolve(new Uint8Array(0)) };
  if (first.status !== 206) throw new Error(`${url.pathname}: expected a partial answer (HTTP 206) to a byte-range request, found HTTP ${first.status}`);
  const size = totalFromContentRange(first.headers.get('content-range'));
  if (size === null) throw new Error(`${url.pathname}: expected a Content-Range header giving the file size`);
  const head = new Uint8Array(await first.arrayBuffer());
  return {
    size,
    async read(offset, length) {
      const from = Math.max(0, offset);
      const to = Math.min(size, offset + length);
      if (to <= from) return new Uint8Array(0);
      if (to <= head.length) return head.subarray(from, to);
      const r = await fetchFn(url, { headers: { range: `bytes=${from}-${to - 1}` } });
      if (r.status !== 206) throw new Error(`${url.pathname}: byte range ${from}-${to - 1} not served (HTTP ${r.status})`);
      return new Uint8Array(await r.arrayBuffer());
    },
  };
}

/** The demo's raw folder served at demo/raw/ beside the page (names cannot be listed over HTTP). */
export function httpRawFolder(base: URL, label: string): RawFolder {
  return {
    label,
    names: null,
    open: async (name) => {
      const source = await httpRangeSource(new URL(encodeURIComponent(baseName(name)), base));
      return source && blockCached(source);
    },
  };
}
