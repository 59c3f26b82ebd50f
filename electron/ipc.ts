/**
 * Registers one handler per invoke channel. Every request is checked centrally first: it must
 * come from the main frame of a page on our app protocol. Handlers validate their own payloads.
 */
import { ipcMain, type IpcMainInvokeEvent } from 'electron';
import { isAppUrl } from './app-url.ts';
import { INVOKE_CHANNELS, type InvokeMethod } from './channels.ts';
import { PayloadError } from './validate.ts';

export type InvokeHandlers = {
  [M in InvokeMethod]: (event: IpcMainInvokeEvent, args: unknown[]) => Promise<unknown>;
};

function checkSender(event: IpcMainInvokeEvent, method: string): void {
  const frame = event.senderFrame;
  if (!frame || frame.parent !== null || !isAppUrl(frame.url)) {
    throw new PayloadError(`${method}: refused a request from outside the app (${frame?.url ?? 'unknown frame'})`);
  }
}

export function registerIpc(handlers: InvokeHandlers): void {
  for (const method of Object.keys(INVOKE_CHANNELS) as InvokeMethod[]) {
    ipcMain.handle(INVOKE_CHANNELS[method], (event, ...args: unknown[]) => {
      checkSender(event, method);
      return handlers[method](event, args);
    });
  }
}
