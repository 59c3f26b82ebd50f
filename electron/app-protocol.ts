/**
 * Serves the built renderer (dist/renderer) on the app protocol, with a strict CSP on every
 * response. Files outside the renderer folder are never served.
 */
import { readFile } from 'node:fs/promises';
import { protocol } from 'electron';
import { APP_CSP, APP_SCHEME, contentTypeOf, resolveAppFile } from './app-url.ts';

/** Must run before the app is ready. */
export function registerAppScheme(): void {
  protocol.registerSchemesAsPrivileged([
    { scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, corsEnabled: true, stream: true } },
  ]);
}

export function serveRenderer(rendererRoot: string): void {
  protocol.handle(APP_SCHEME, async (request) => {
    const file = resolveAppFile(rendererRoot, request.url);
    if (!file) return new Response('not found', { status: 404 });
    let body: Buffer;
    try {
      body = await readFile(file);
    } catch {
      return new Response('not found', { status: 404 });
    }
    return new Response(new Uint8Array(body), {
      status: 200,
      headers: {
        'content-type': contentTypeOf(file),
        'content-security-policy': APP_CSP,
        'x-content-type-options': 'nosniff',
        'cache-control': 'no-store',
      },
    });
  });
}
