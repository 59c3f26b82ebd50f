/**
 * The application menu: File (Open…, Export…, Quit), Edit (for text fields), Help (About). Open
 * and Export are sent to the renderer, which owns the study and runs the host calls itself.
 */
import { app, BrowserWindow, dialog, Menu, type MenuItemConstructorOptions } from 'electron';
import { MENU_CHANNEL, type MenuCommandName } from './channels.ts';

function send(command: MenuCommandName): void {
  const win = BrowserWindow.getFocusedWindow() ?? BrowserWindow.getAllWindows()[0];
  win?.webContents.send(MENU_CHANNEL, command);
}

async function about(): Promise<void> {
  const options = {
    type: 'info' as const,
    title: 'About Gleaner',
    message: `Gleaner ${app.getVersion()}`,
    detail:
      'Find, inspect and name behaviour clusters in featurized wearable-sensor windows, and export them as weak labels with provenance.\n\n' +
      'Weak labels and clusters are research aids, not clinical findings or diagnoses. Handle participant data under your ethics approval, ' +
      'consent terms and local privacy law; Gleaner keeps all data on this machine.',
    buttons: ['OK'],
  };
  const win = BrowserWindow.getFocusedWindow();
  if (win) await dialog.showMessageBox(win, options);
  else await dialog.showMessageBox(options);
}

export function buildMenu(): Menu {
  const isMac = process.platform === 'darwin';
  const template: MenuItemConstructorOptions[] = [
    ...(isMac ? [{ role: 'appMenu' as const }] : []),
    {
      label: 'File',
      submenu: [
        { label: 'Open…', accelerator: 'CmdOrCtrl+O', click: () => send('open') },
        { label: 'Export…', accelerator: 'CmdOrCtrl+E', click: () => send('export') },
        { type: 'separator' },
        isMac ? { role: 'close' } : { role: 'quit', label: 'Quit' },
      ],
    },
    { role: 'editMenu' },
    {
      label: 'View',
      submenu: [
        { role: 'resetZoom' },
        { role: 'zoomIn' },
        { role: 'zoomOut' },
        { type: 'separator' },
        { role: 'togglefullscreen' },
        ...(app.isPackaged ? [] : [{ role: 'toggleDevTools' as const }]),
      ],
    },
    {
      role: 'help',
      submenu: [{ label: 'About Gleaner', click: () => void about() }],
    },
  ];
  return Menu.buildFromTemplate(template);
}
