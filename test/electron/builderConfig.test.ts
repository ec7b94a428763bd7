import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Ajv from 'ajv';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const readJson = (file: string) => JSON.parse(readFileSync(path.join(root, file), 'utf8'));
const config = readJson('build/electron-builder.json');

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948, section 11.2.2). */
function pngSize(file: string): { width: number; height: number } {
  const bytes = readFileSync(path.join(root, file));
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

describe('build/electron-builder.json', () => {
  it('passes electron-builder’s own JSON schema', () => {
    const schema = JSON.parse(
      readFileSync(path.join(root, 'node_modules/app-builder-lib/scheme.json'), 'utf8'),
    );
    const validate = new Ajv({ allErrors: true, strict: false }).compile(schema);
    const valid = validate(config);
    expect(validate.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    expect(validate({ ...config, notAnOption: true })).toBe(false);
  });

  it('packs only the built app, publishes nowhere and writes to release/', () => {
    expect(config).toMatchObject({
      appId: 'app.legwise.planner',
      productName: 'Legwise',
      files: ['dist/**', 'dist-electron/**', 'package.json'],
      publish: null,
      directories: { output: 'release' },
    });
    expect(readJson('package.json').main).toBe('dist-electron/main.js');
    expect(JSON.stringify(config)).not.toMatch(/electron-updater|https?:\/\//);
  });

  it('associates our own extensions and turns the file-protocol fuse off', () => {
    // Extensions and names of our own (issue: file associations); mimeType for Linux desktops.
    expect(config.fileAssociations).toEqual([
      expect.objectContaining({ ext: 'legwise', name: 'Legwise plan', role: 'Editor' }),
      expect.objectContaining({ ext: 'lwac', name: 'Legwise aircraft', role: 'Editor' }),
    ]);
    for (const a of config.fileAssociations) expect(a.mimeType).toMatch(/^application\/x-legwise-/);
    // Electron fuses (electron/fuses docs): the page is served by protocol.handle, so
    // file:// needs no extra privileges; nothing may run the app as plain Node.
    expect(config.electronFuses).toMatchObject({
      grantFileProtocolExtraPrivileges: false,
      runAsNode: false,
      onlyLoadAppFromAsar: true,
    });
  });

  it('builds AppImage + deb, NSIS and DMG, with Linux metadata', () => {
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.linux.maintainer).toMatch(/<.+@.+>/);
    expect(config.linux.category).toContain('Utility');
    expect(config.win.target).toEqual(['nsis']);
    expect(config.mac.target).toEqual(['dmg']);
  });

  it('points at icons that exist, at the sizes the packagers need', () => {
    for (const icon of [config.win.icon, config.mac.icon])
      expect(existsSync(path.join(root, icon))).toBe(true);
    // electron-builder: macOS and Windows icons at least 512×512 / 256×256 (its icon documentation).
    expect(pngSize('build/icon.png')).toEqual({ width: 512, height: 512 });
    expect(pngSize(path.join(config.linux.icon, '512x512.png'))).toEqual({
      width: 512,
      height: 512,
    });
    expect(pngSize(path.join(config.linux.icon, '256x256.png'))).toEqual({
      width: 256,
      height: 256,
    });
    expect(readFileSync(path.join(root, 'build/icon.svg'), 'utf8')).toMatch(
      /^<svg[^>]+viewBox="0 0 512 512"/,
    );
  });
});
