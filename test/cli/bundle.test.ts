/**
 * The command ships as one built file: dist-cli/legwise.mjs (built by the vitest global
 * setup from today's sources, as `npm ci` builds it through `prepare`). It may import only
 * Node's built-ins, and the package declares no run-time dependencies — everything the CLI,
 * the page and the desktop shell use is bundled, so a packaged app carries no node_modules
 * (electron-builder copies only `dependencies`; electron-builder docs, "Application
 * Contents").
 */
import { readFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { describe, expect, it } from 'vitest';

const ROOT = new URL('../../', import.meta.url);

describe('the built command', () => {
  it('imports only Node built-ins', () => {
    const text = readFileSync(new URL('dist-cli/legwise.mjs', ROOT), 'utf8');
    const specifiers = [...text.matchAll(/^import\s[^'"]*['"]([^'"]+)['"]/gm)].map((m) => m[1]);
    expect(specifiers.length).toBeGreaterThan(0);
    for (const s of specifiers) {
      const bare = (s as string).replace(/^node:/, '');
      expect(builtinModules).toContain(bare);
    }
    expect(text).not.toMatch(/\bfrom\s+['"](tsx|zod|vue)['"]/);
  });

  it('package.json has no run-time dependencies and builds the CLI on prepare', () => {
    const pkg = JSON.parse(readFileSync(new URL('package.json', ROOT), 'utf8')) as {
      dependencies?: Record<string, string>;
      devDependencies: Record<string, string>;
      scripts: Record<string, string>;
      bin: Record<string, string>;
    };
    expect(Object.keys(pkg.dependencies ?? {})).toEqual([]);
    expect(pkg.devDependencies).toHaveProperty('tsx');
    expect(pkg.scripts.prepare).toBe('node cli/build.mjs');
    expect(pkg.bin.legwise).toBe('bin/legwise.mjs');
  });
});
