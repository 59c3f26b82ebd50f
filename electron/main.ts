/**
 * Electron main: one window, the renderer served from the app protocol, the bridge's
 * requests handled with validated payloads. Nothing heavy runs here; the renderer's workers
 * do the computing.
 *
 * Flags: --demo opens the demo study on start.
 */
import { join } from 'node:path';
import { app, BrowserWindow, Menu } from 'electron';
import { appEntryUrl } from './app-url.ts';
import { registerAppScheme, serveRenderer } from './app-protocol.ts';
import { chooseRawFolder, demoRawFolder, loadDemo, openWindowsFile, saveFiles } from './files.ts';
import { InputGuard } from './input-guard.ts';
import { registerIpc } from './ipc.ts';
import { buildMenu } from './menu.ts';
import { RawFolders, validateRawRead } from './raw-folders.ts';
import { hardenAllWebContents, hardenDefaultSession, secureWebPreferences } from './security.ts';
import { StudyFiles } from './study-files.ts';
import { PayloadError, validateNoArguments, validateSaveRequest } from './validate.ts';
import { validateAutosave, validateKey, validateRecentName, validateStudySave } from './validate-study.ts';

const demo = process.argv.includes('--demo');
const guard = new InputGuard(process.platform);
const studies = new StudyFiles(guard);
const rawFolders = new RawFolders();

app.enableSandbox();
registerAppScheme();
hardenAllWebContents();

if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
  app.on('second-instance', () => {
    const win = BrowserWindow.getAllWindows()[0];
    if (win) {
      if (win.isMinimized()) win.restore();
      win.focus();
    }
  });
  void app.whenReady().then(start);
}

function start(): void {
  hardenDefaultSession();
  serveRenderer(join(app.getAppPath(), 'dist', 'renderer'));
  registerIpc({
    openWindowsFile: async (event, args) => {
      validateNoArguments('openWindowsFile', args);
      return openWindowsFile(BrowserWindow.fromWebContents(event.sender), guard);
    },
    loadDemo: async (_event, args) => {
      validateNoArguments('loadDemo', args);
      return loadDemo(guard);
    },
    saveFiles: async (event, args) => {
      if (args.length !== 2) throw new PayloadError(`saveFiles: expected 2 arguments, found ${args.length}`);
      const request = validateSaveRequest(args[0], args[1]);
      return saveFiles(BrowserWindow.fromWebContents(event.sender), guard, request);
    },
    saveStudy: async (event, args) => studies.save(BrowserWindow.fromWebContents(event.sender), validateStudySave(args)),
    openStudy: async (event, args) => studies.open(BrowserWindow.fromWebContents(event.sender), validateRecentName(args)),
    recentStudies: async (_event, args) => {
      validateNoArguments('recentStudies', args);
      return studies.recent();
    },
    writeAutosave: async (_event, args) => studies.writeAutosave(validateAutosave(args)),
    readAutosave: async (_event, args) => {
      if (args.length !== 1) throw new PayloadError(`readAutosave: expected 1 argument, found ${args.length}`);
      return studies.readAutosave(args[0] === null ? null : validateKey('readAutosave', args[0]));
    },
    clearAutosave: async (_event, args) => {
      if (args.length !== 1) throw new PayloadError(`clearAutosave: expected 1 argument, found ${args.length}`);
      return studies.clearAutosave(validateKey('clearAutosave', args[0]));
    },
    chooseRawFolder: async (event, args) => {
      validateNoArguments('chooseRawFolder', args);
      return chooseRawFolder(BrowserWindow.fromWebContents(event.sender), rawFolders);
    },
    demoRawFolder: async (_event, args) => {
      validateNoArguments('demoRawFolder', args);
      return demoRawFolder(rawFolders);
    },
    readRaw: async (_event, args) => rawFolders.read(validateRawRead(args)),
  });
  Menu.setApplicationMenu(buildMenu());
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
}

function createWindow(): void {
  const win = new BrowserWindow({
    width: 1360,
    height: 860,
    minWidth: 900,
    minHeight: 600,
    title: 'Gleaner',
    show: false,
    backgroundColor: '#1b1f27',
    webPreferences: secureWebPreferences(join(__dirname, 'preload.js')),
  });
  win.once('ready-to-show', () => win.show());
  void win.loadURL(appEntryUrl(demo));
}

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
