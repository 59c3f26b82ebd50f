// Checks of the packaging configuration (build/electron-builder.yml) and the app icon, without
// packaging (that downloads Electron). The schema is electron-builder's own: app-builder-lib's
// scheme.json, as installed with electron-builder 25.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';

const require = createRequire(import.meta.url);
const yaml = require('js-yaml') as { load(text: string): unknown };
const Ajv = require('ajv') as new (options: object) => { compile(schema: object): ((data: unknown) => boolean) & { errors?: unknown[] | null } };

const config = yaml.load(readFileSync('build/electron-builder.yml', 'utf8')) as Record<string, unknown> & {
  files: string[];
  linux: { target: string[] };
  mac: { target: string };
  win: { target: string };
};

describe('build/electron-builder.yml', () => {
  it("validates against electron-builder's configuration schema (app-builder-lib scheme.json)", () => {
    const schema = JSON.parse(readFileSync(require.resolve('app-builder-lib/scheme.json'), 'utf8')) as object;
    const validate = new Ajv({ allErrors: true, strict: false }).compile(schema);
    const ok = validate(config);
    expect(validate.errors ?? [], JSON.stringify(validate.errors)).toEqual([]);
    expect(ok).toBe(true);
    // The schema is strict about unknown keys, so the check above can fail.
    expect(validate({ ...config, linx: {} })).toBe(false);
  });

  it('ships the renderer, the compiled shell, the demo study and package.json, for Linux, macOS and Windows', () => {
    expect(config.appId).toBeTruthy();
    expect(config.productName).toBe('Gleaner');
    for (const entry of ['dist/renderer/**/*', 'dist-electron/**/*', 'demo-data/windows.csv', 'package.json']) expect(config.files).toContain(entry);
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.mac.target).toBe('dmg');
    expect(config.win.target).toBe('nsis');
  });

  it("packages the entry point package.json names", () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { main: string };
    expect(pkg.main).toBe('dist-electron/main.js');
  });
});

describe('build/icon.png', () => {
  it('is a 512 × 512 RGBA PNG (PNG spec, IHDR chunk: width, height, bit depth 8, colour type 6)', () => {
    expect(existsSync('build/icon.png')).toBe(true);
    const png = readFileSync('build/icon.png');
    // PNG signature and IHDR layout: W3C PNG Specification (Second Edition), §5.2 and §11.2.2.
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.subarray(12, 16).toString('ascii')).toBe('IHDR');
    expect(png.readUInt32BE(16)).toBe(512);
    expect(png.readUInt32BE(20)).toBe(512);
    expect(png[24]).toBe(8);
    expect(png[25]).toBe(6);
  });
});
