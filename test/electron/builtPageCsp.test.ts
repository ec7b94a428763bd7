import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { builtPageCsp } from '../../vite.config.ts';
import { CONTENT_SECURITY_POLICY } from '../../electron/security.ts';

// Issue "Desktop shell": the page Electron loads must carry the shell's strict policy
// (no unsafe-eval, no remote origins), while the dev page may keep ws: for hot reload.
describe('content security policy of the built page', () => {
  const source = readFileSync(new URL('../../renderer/index.html', import.meta.url), 'utf8');
  const plugin = builtPageCsp();
  const transform = plugin.transformIndexHtml as (html: string) => string;

  it('replaces the dev policy with the canonical one exactly', () => {
    const built = transform(source);
    const content = /http-equiv="Content-Security-Policy"\s+content="([^"]*)"/.exec(built)?.[1];
    expect(content).toBe(CONTENT_SECURITY_POLICY);
    expect(built).not.toContain('ws://');
    expect(content).not.toContain('unsafe-eval');
  });

  it('runs only for builds and refuses a page without the meta tag', () => {
    expect(plugin.apply).toBe('build');
    expect(() => transform('<html><head></head></html>')).toThrow(/Content-Security-Policy/);
  });
});
