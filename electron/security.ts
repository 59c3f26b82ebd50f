/**
 * Secure defaults for every window and the app's session: sandboxed renderer with context
 * isolation, no navigation, no new windows, no webviews, no permissions, no network.
 */
import { app, session, type WebContents, type WebPreferences } from 'electron';
import { isAllowedRequestUrl } from './app-url.ts';

export function secureWebPreferences(preload: string): WebPreferences {
  return {
    preload,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    experimentalFeatures: false,
    navigateOnDragDrop: false,
    spellcheck: false,
  };
}

/** Denies new windows, navigation, redirects and webviews in any web contents the app creates. */
export function hardenAllWebContents(): void {
  app.on('web-contents-created', (_event, contents: WebContents) => {
    contents.setWindowOpenHandler(() => ({ action: 'deny' }));
    contents.on('will-navigate', (event) => event.preventDefault());
    contents.on('will-frame-navigate', (event) => event.preventDefault());
    contents.on('will-redirect', (event) => event.preventDefault());
    contents.on('will-attach-webview', (event) => event.preventDefault());
  });
}

/** No permission prompts (camera, notifications, ...) and no request leaves the machine. */
export function hardenDefaultSession(): void {
  const s = session.defaultSession;
  s.setPermissionRequestHandler((_contents, permission, callback) => callback(permission === 'clipboard-sanitized-write'));
  s.setPermissionCheckHandler((_contents, permission) => permission === 'clipboard-sanitized-write');
  s.webRequest.onBeforeRequest({ urls: ['<all_urls>'] }, (details, callback) => {
    callback({ cancel: !isAllowedRequestUrl(details.url) });
  });
}
