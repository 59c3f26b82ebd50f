// Tests of the app-protocol rules (electron/app-url.ts, no electron import).
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { APP_CSP, appEntryUrl, contentTypeOf, isAllowedRequestUrl, isAppUrl, resolveAppFile } from '../../electron/app-url.ts';

const root = resolve('/opt/gleaner/dist/renderer');

describe('isAppUrl(url)', () => {
  it('accepts pages on the app protocol', () => {
    expect(isAppUrl('gleaner-app://app/index.html')).toBe(true);
    expect(isAppUrl('gleaner-app://app/index.html?demo=1#map')).toBe(true);
    expect(isAppUrl(appEntryUrl(true))).toBe(true);
  });

  it('refuses every other origin, and non-strings', () => {
    for (const url of ['http://127.0.0.1:5317/', 'https://app/index.html', 'file:///opt/gleaner/dist/renderer/index.html', 'gleaner-app://evil/index.html', 'gleaner-app://user:pw@app/', 'about:blank', 'data:text/html,x', 'not a url', '']) {
      expect(isAppUrl(url), url).toBe(false);
    }
    expect(isAppUrl(undefined)).toBe(false);
    expect(isAppUrl(null)).toBe(false);
  });
});

describe('resolveAppFile(root, url)', () => {
  it('maps app URLs to files under the renderer folder, "/" to index.html', () => {
    expect(resolveAppFile(root, 'gleaner-app://app/')).toBe(join(root, 'index.html'));
    expect(resolveAppFile(root, 'gleaner-app://app/index.html?demo=1')).toBe(join(root, 'index.html'));
    expect(resolveAppFile(root, 'gleaner-app://app/assets/index-abc.js')).toBe(join(root, 'assets', 'index-abc.js'));
    expect(resolveAppFile(root, 'gleaner-app://app/assets/map%20view.js')).toBe(join(root, 'assets', 'map view.js'));
  });

  it('never leaves the renderer folder', () => {
    // Dot segments and their percent-encodings (RFC 3986 §5.2.4, §2.1): common practice for path traversal.
    for (const url of [
      'gleaner-app://app/../../etc/passwd',
      'gleaner-app://app/%2e%2e/%2e%2e/etc/passwd',
      'gleaner-app://app/assets/%2E%2E%2F%2E%2E%2F..%2Fsecret',
      'gleaner-app://app/..%5c..%5csecret',
      'gleaner-app://app/%00index.html',
      'gleaner-app://app/%E0%A4%A',
      'gleaner-app://other/index.html',
      'http://127.0.0.1/index.html',
    ]) {
      const file = resolveAppFile(root, url);
      if (file !== null) expect(file.startsWith(root + '/') || file.startsWith(root + '\\'), `${url} -> ${file}`).toBe(true);
      else expect(file).toBeNull();
    }
    // The URL parser already folds "%2e%2e" segments (WHATWG URL Standard, "double-dot path segment"),
    // so this one lands inside the folder; encoded separators and NUL are refused outright.
    expect(resolveAppFile(root, 'gleaner-app://app/%2e%2e/%2e%2e/etc/passwd')).toBe(join(root, 'etc', 'passwd'));
    expect(resolveAppFile(root, 'gleaner-app://app/assets/%2E%2E%2F%2E%2E%2F..%2Fsecret')).toBeNull();
    expect(resolveAppFile(root, 'gleaner-app://app/..%5c..%5csecret')).toBeNull();
    expect(resolveAppFile(root, 'gleaner-app://app/%00index.html')).toBeNull();
    expect(resolveAppFile(root, 'gleaner-app://other/index.html')).toBeNull();
  });
});

describe('contentTypeOf(file)', () => {
  it('serves scripts as JavaScript (module workers need it) and unknown files as bytes', () => {
    // Module scripts require a JavaScript MIME type: HTML Living Standard, "fetch a single module script" (from memory).
    expect(contentTypeOf('/a/index-x.js')).toMatch(/^text\/javascript/);
    expect(contentTypeOf('/a/index.HTML')).toMatch(/^text\/html/);
    expect(contentTypeOf('/a/x.wasm')).toBe('application/wasm');
    expect(contentTypeOf('/a/x.bin')).toBe('application/octet-stream');
  });
});

describe('APP_CSP and isAllowedRequestUrl(url)', () => {
  it('allows only our own origin for scripts and no remote content', () => {
    expect(APP_CSP).toContain("default-src 'self'");
    expect(APP_CSP).toContain("script-src 'self'");
    expect(APP_CSP).toContain("object-src 'none'");
    expect(APP_CSP).not.toMatch(/unsafe-eval|https?:|\*/);
  });

  it('lets the session load the app protocol and in-memory URLs, never the network or local files', () => {
    expect(isAllowedRequestUrl('gleaner-app://app/assets/worker.js')).toBe(true);
    expect(isAllowedRequestUrl('blob:gleaner-app://app/1234')).toBe(true);
    expect(isAllowedRequestUrl('data:image/png;base64,AAAA')).toBe(true);
    for (const url of ['https://example.org/x.js', 'http://127.0.0.1:5317/', 'ws://localhost:1/', 'file:///etc/passwd', 'gleaner-app://other/x']) {
      expect(isAllowedRequestUrl(url), url).toBe(false);
    }
  });
});
