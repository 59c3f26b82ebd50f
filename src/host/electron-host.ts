import { bridgeRawFolder } from './raw-electron';
import type { ElectronBridge, ElectronHost, FileToWrite, MenuCommand, OpenedFile, SaveOutcome } from './host';

// Electron wraps errors thrown in main as "Error invoking remote method '<channel>': <Name>: <message>".
const REMOTE_PREFIX = /^Error invoking remote method '[^']*': (?:[A-Za-z]*Error: )?/;

/** The message main gave, without Electron's IPC wrapping, so the status line reads plainly. */
export function unwrapRemoteError(err: unknown): Error {
  if (err instanceof Error && REMOTE_PREFIX.test(err.message)) return new Error(err.message.replace(REMOTE_PREFIX, ''));
  return err instanceof Error ? err : new Error(String(err));
}

async function call<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (err) {
    throw unwrapRemoteError(err);
  }
}

/**
 * The desktop host: a thin adapter over the preload's bridge (window.gleanerHost). Dialogs, file
 * access and validation all happen in Electron's main process.
 */
export function electronHost(bridge: ElectronBridge): ElectronHost {
  return {
    kind: 'electron',
    openWindowsFile: (): Promise<OpenedFile | null> => call(() => bridge.openWindowsFile()),
    loadDemo: (): Promise<OpenedFile> => call(() => bridge.loadDemo()),
    saveFiles: (suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null> =>
      call(() => bridge.saveFiles(suggestedFolder, files)),
    onMenuCommand: (listener: (command: MenuCommand) => void): (() => void) => bridge.onMenuCommand(listener),
    saveStudy: (suggestedName, bytes, options) => call(() => bridge.saveStudy(suggestedName, bytes, options.saveAs)),
    openStudy: (recent) => call(() => bridge.openStudy(recent ?? null)),
    recentStudies: () => call(() => bridge.recentStudies()),
    writeAutosave: (entry) => call(() => bridge.writeAutosave(entry)),
    readAutosave: (key) => call(() => bridge.readAutosave(key ?? null)),
    clearAutosave: (key) => call(() => bridge.clearAutosave(key)),
    chooseRawFolder: async () => {
      const listed = await call(() => bridge.chooseRawFolder());
      return listed ? bridgeRawFolder(bridge, listed, call) : null;
    },
    demoRawFolder: async () => {
      const listed = await call(() => bridge.demoRawFolder());
      return listed ? bridgeRawFolder(bridge, { ...listed, label: "the demo's raw signals" }, call) : null;
    },
  };
}
