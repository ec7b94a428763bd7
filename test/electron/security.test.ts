import { EventEmitter } from 'node:events';
import { describe, expect, it, vi } from 'vitest';
import {
  CONTENT_SECURITY_POLICY,
  applySessionPolicy,
  hardenWebContents,
  isAllowedRequestUrl,
  localDevServerUrl,
  withCspHeader,
} from '../../electron/security.ts';

describe('content security policy', () => {
  it('allows only our own scripts and no plugins, frames, forms or base changes', () => {
    const directives = Object.fromEntries(
      CONTENT_SECURITY_POLICY.split(';').map((d) => {
        const [name = '', ...values] = d.trim().split(/\s+/);
        return [name, values.join(' ')];
      }),
    );
    expect(directives).toEqual({
      'default-src': "'self'",
      'script-src': "'self'",
      'style-src': "'self' 'unsafe-inline'",
      'img-src': "'self' data:",
      'connect-src': "'self'",
      'object-src': "'none'",
      'base-uri': "'none'",
      'form-action': "'none'",
      'frame-ancestors': "'none'",
    });
  });

  it('replaces any CSP header a server sends', () => {
    const out = withCspHeader({ 'content-security-policy': ['*'], 'Content-Type': ['text/html'] });
    expect(out).toEqual({
      'Content-Type': ['text/html'],
      'Content-Security-Policy': [CONTENT_SECURITY_POLICY],
    });
  });
});

describe('network policy', () => {
  it('lets through our own page only, and the local dev server while developing', () => {
    expect(isAllowedRequestUrl('legwise://app/assets/index.js')).toBe(true);
    // The page is served by the shell's protocol: file:// (the disk) is never reachable.
    expect(isAllowedRequestUrl('file:///opt/legwise/dist/assets/index.js')).toBe(false);
    expect(isAllowedRequestUrl('file:///etc/passwd')).toBe(false);
    expect(isAllowedRequestUrl('legwise://elsewhere/index.html')).toBe(false);
    expect(isAllowedRequestUrl('data:image/png;base64,AAAA')).toBe(true);
    expect(isAllowedRequestUrl('https://update.example.com/latest')).toBe(false);
    expect(isAllowedRequestUrl('http://127.0.0.1:5173/src/main.ts')).toBe(false);
    const dev = 'http://127.0.0.1:5173';
    expect(isAllowedRequestUrl('http://127.0.0.1:5173/src/main.ts', dev)).toBe(true);
    expect(isAllowedRequestUrl('ws://127.0.0.1:5173/', dev)).toBe(true);
    expect(isAllowedRequestUrl('https://fonts.example.com/x.woff2', dev)).toBe(false);
    expect(isAllowedRequestUrl('::not a url::')).toBe(false);
  });

  it('accepts only a plain-http dev server on this machine', () => {
    expect(localDevServerUrl('http://127.0.0.1:5173')).toBe('http://127.0.0.1:5173/');
    expect(localDevServerUrl('http://localhost:5173/')).toBe('http://localhost:5173/');
    expect(localDevServerUrl('http://192.168.1.9:5173/')).toBeUndefined();
    expect(localDevServerUrl('https://example.com/')).toBeUndefined();
    expect(localDevServerUrl(undefined)).toBeUndefined();
  });

  it('denies every permission and cancels outside requests in the session', () => {
    const session = {
      setPermissionRequestHandler: vi.fn(),
      setPermissionCheckHandler: vi.fn(),
      setDevicePermissionHandler: vi.fn(),
      setSpellCheckerEnabled: vi.fn(),
      webRequest: { onBeforeRequest: vi.fn(), onHeadersReceived: vi.fn() },
    };
    applySessionPolicy(session as never);
    const answer = vi.fn();
    session.setPermissionRequestHandler.mock.calls[0]?.[0]({}, 'geolocation', answer);
    expect(answer).toHaveBeenCalledWith(false);
    expect(session.setPermissionCheckHandler.mock.calls[0]?.[0]()).toBe(false);
    expect(session.setSpellCheckerEnabled).toHaveBeenCalledWith(false);
    const decide = vi.fn();
    session.webRequest.onBeforeRequest.mock.calls[0]?.[0]({ url: 'https://example.com/' }, decide);
    expect(decide).toHaveBeenCalledWith({ cancel: true });
    const headers = vi.fn();
    session.webRequest.onHeadersReceived.mock.calls[0]?.[0]({ responseHeaders: {} }, headers);
    expect(headers).toHaveBeenCalledWith({
      responseHeaders: { 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] },
    });
  });
});

describe('hardenWebContents', () => {
  it('prevents navigation, redirects and <webview>, and denies new windows', () => {
    const contents = Object.assign(new EventEmitter(), { setWindowOpenHandler: vi.fn() });
    hardenWebContents(contents as never);
    for (const event of ['will-navigate', 'will-redirect', 'will-attach-webview']) {
      const e = { preventDefault: vi.fn() };
      contents.emit(event, e, 'https://example.com/');
      expect(e.preventDefault, event).toHaveBeenCalled();
    }
    const openHandler = contents.setWindowOpenHandler.mock.calls[0]?.[0];
    expect(openHandler({ url: 'https://example.com/' })).toEqual({ action: 'deny' });
  });
});
