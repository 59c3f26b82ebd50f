import { blockCached } from './block-cache';
import type { ElectronBridge } from './host';
import type { BridgeRawFolder, RawFolder } from './raw-folder';
import { baseName } from './raw-folder';

/** A raw folder remembered in Electron's main: reads go through the validated readRaw request. */
export function bridgeRawFolder(bridge: Pick<ElectronBridge, 'readRaw'>, listed: BridgeRawFolder, wrap: <T>(run: () => Promise<T>) => Promise<T>): RawFolder {
  const sizes = new Map(listed.files.map((f) => [f.name, f.size]));
  return {
    label: listed.label,
    names: listed.files.map((f) => f.name),
    open(path) {
      const name = baseName(path);
      const size = sizes.get(name);
      if (size === undefined) return Promise.resolve(null);
      return Promise.resolve(blockCached({
        size,
        read: (offset: number, length: number) => {
          const from = Math.max(0, Math.floor(offset));
          const n = Math.max(0, Math.min(Math.floor(length), size - from));
          return n === 0 ? Promise.resolve(new Uint8Array(0)) : wrap(() => bridge.readRaw(listed.id, name, from, n));
        },
      }));
    },
  };
}
