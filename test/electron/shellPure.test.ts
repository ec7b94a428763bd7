/**
 * Pure parts of the desktop conventions: which command-line argument is a plan, where a
 * remembered window may reappear, and what the page's own protocol will serve.
 */
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  APP_INDEX_URL,
  appProtocolHandler,
  mimeOf,
  resolveAppRequest,
} from '../../electron/appProtocol.ts';
import { planPathFromArgv } from '../../electron/openRequests.ts';
import { boundsToRestore } from '../../electron/windowState.ts';
import { CONTENT_SECURITY_POLICY } from '../../electron/security.ts';
import { SHORTCUTS, keyLabel } from '../../electron/shortcutList.ts';
import { ACCELERATORS } from '../../electron/menu.ts';

describe('planPathFromArgv', () => {
  const cwd = '/home/pilot';
  it('skips the executable, the app folder and switches; resolves against cwd', () => {
    expect(
      planPathFromArgv(['/opt/Legwise/legwise', '--no-sandbox', 'plans/a.legwise'], {
        isPackaged: true,
        cwd,
      }),
    ).toBe('/home/pilot/plans/a.legwise');
    expect(
      planPathFromArgv(['electron', '.', '-psn_0_12345', '/tmp/b.json'], {
        isPackaged: false,
        cwd,
      }),
    ).toBe('/tmp/b.json');
  });

  it('finds nothing without a plan-named argument', () => {
    expect(planPathFromArgv(['/opt/Legwise/legwise'], { isPackaged: true, cwd })).toBeNull();
    expect(
      planPathFromArgv(['/opt/Legwise/legwise', 'notes.txt'], { isPackaged: true, cwd }),
    ).toBeNull();
    // Unpackaged, the app folder itself is never taken for a file.
    expect(planPathFromArgv(['electron', 'app.json'], { isPackaged: false, cwd })).toBeNull();
  });
});

describe('boundsToRestore', () => {
  const laptop = { x: 0, y: 0, width: 1440, height: 900 };
  const monitor = { x: 1440, y: 0, width: 2560, height: 1440 };
  const saved = { x: 1600, y: 100, width: 1200, height: 800, maximized: true };

  it('keeps a position that is on a display today', () => {
    expect(boundsToRestore(saved, [laptop, monitor])).toEqual({
      bounds: { x: 1600, y: 100, width: 1200, height: 800 },
      maximized: true,
    });
  });

  it('drops a position on a display that is gone, keeping a size that fits', () => {
    expect(boundsToRestore({ ...saved, width: 2000 }, [laptop])).toEqual({
      bounds: { width: 1440, height: 800 },
      maximized: true,
    });
  });

  it('nothing saved: the default size', () => {
    expect(boundsToRestore(null, [laptop])).toBeNull();
  });
});

describe('the page’s own protocol', () => {
  const dist = '/opt/legwise/dist';
  it('maps legwise://app/ paths into dist/ only', () => {
    expect(resolveAppRequest(APP_INDEX_URL, dist)).toBe(path.join(dist, 'index.html'));
    expect(resolveAppRequest('legwise://app/', dist)).toBe(path.join(dist, 'index.html'));
    expect(resolveAppRequest('legwise://app/assets/a.js?v=1#x', dist)).toBe(
      path.join(dist, 'assets', 'a.js'),
    );
    // Dot segments, plain or percent-encoded, never climb out of dist/ (WHATWG URL
    // parsing removes the plain ones; the encoded ones are checked after decoding).
    for (const climb of [
      'legwise://app/../secret',
      'legwise://app/%2e%2e/secret',
      'legwise://app/assets/%2e%2e%2f%2e%2e%2f%2e%2e%2fsecret',
    ]) {
      const file = resolveAppRequest(climb, dist);
      expect(file === null || file.startsWith(dist + path.sep), climb).toBe(true);
    }
    expect(resolveAppRequest('legwise://app/assets/%2e%2e%2f%2e%2e%2fsecret', dist)).toBeNull();
    for (const bad of [
      'legwise://app/a%00.js',
      'legwise://other/index.html',
      'file:///opt/legwise/dist/index.html',
      'legwise://app/%E0%A4%A',
    ])
      expect(resolveAppRequest(bad, dist), bad).toBeNull();
  });

  it('answers with the file, its type and our CSP; 404 for anything else', async () => {
    const files = new Map([[path.join(dist, 'index.html'), new TextEncoder().encode('<html>')]]);
    const handler = appProtocolHandler(dist, async (file) => {
      const body = files.get(file);
      if (!body) throw Object.assign(new Error('missing'), { code: 'ENOENT' });
      return body;
    });
    const ok = await handler({ url: APP_INDEX_URL, method: 'GET' });
    expect(ok.status).toBe(200);
    expect(await ok.text()).toBe('<html>');
    expect(ok.headers.get('content-type')).toBe('text/html; charset=utf-8');
    expect(ok.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect((await handler({ url: 'legwise://app/missing.js' })).status).toBe(404);
    expect((await handler({ url: APP_INDEX_URL, method: 'POST' })).status).toBe(405);
    // MIME types: RFC 9239 (text/javascript) and the CSS / HTML registrations.
    expect(mimeOf('a.js')).toBe('text/javascript; charset=utf-8');
    expect(mimeOf('a.css')).toBe('text/css; charset=utf-8');
  });
});

describe('shortcut list', () => {
  it('is the menu’s source, and reads with the platform’s modifier names', () => {
    expect(ACCELERATORS.print).toBe('CmdOrCtrl+P');
    expect(new Set(SHORTCUTS.map((s) => s.accelerator)).size).toBe(SHORTCUTS.length);
    expect(keyLabel('CmdOrCtrl+Shift+S', false)).toBe('Ctrl+Shift+S');
    expect(keyLabel('CmdOrCtrl+Shift+S', true)).toBe('⌘⇧S');
  });
});
