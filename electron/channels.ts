/**
 * The one list of IPC channels between the renderer (through the preload) and main. The preload
 * exposes one method per invoke channel; main registers one handler per invoke channel.
 * No electron import here: tests and both Electron processes share this file.
 */

/** Renderer → main requests, keyed by the bridge method that sends them. */
export const INVOKE_CHANNELS = {
  openWindowsFile: 'gleaner:open-windows-file',
  loadDemo: 'gleaner:load-demo',
  saveFiles: 'gleaner:save-files',
  chooseRawFolder: 'gleaner:choose-raw-folder',
  demoRawFolder: 'gleaner:demo-raw-folder',
  readRaw: 'gleaner:read-raw',
  saveStudy: 'gleaner:save-study',
  openStudy: 'gleaner:open-study',
  recentStudies: 'gleaner:recent-studies',
  writeAutosave: 'gleaner:write-autosave',
  readAutosave: 'gleaner:read-autosave',
  clearAutosave: 'gleaner:clear-autosave',
} as const;

export type InvokeMethod = keyof typeof INVOKE_CHANNELS;

/** Main → renderer: a menu item the renderer should act on (it owns the data to export). */
export const MENU_CHANNEL = 'gleaner:menu';

export const MENU_COMMANDS = ['open', 'export'] as const;
export type MenuCommandName = (typeof MENU_COMMANDS)[number];

export function isMenuCommand(value: unknown): value is MenuCommandName {
  return typeof value === 'string' && (MENU_COMMANDS as readonly string[]).includes(value);
}
