import type { ElectronBridge, FileToWrite, Host, MenuCommand, OpenedFile, SaveOutcome } from './host';

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
export function electronHost(bridge: ElectronBridge): Host {
  return {
    kind: 'electron',
    openWindowsFile: (): Promise<OpenedFile | null> => call(() => bridge.openWindowsFile()),
    loadDemo: (): Promise<OpenedFile> => call(() => bridge.loadDemo()),
    saveFiles: (suggestedFolder: string, files: FileToWrite[]): Promise<SaveOutcome | null> =>
      call(() => bridge.saveFiles(suggestedFolder, files)),
    onMenuCommand: (listener: (command: MenuCommand) => void): (() => void) => bridge.onMenuCommand(listener),
  };
}
