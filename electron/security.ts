/**
 * Security policy of the desktop shell, after Electron's security checklist
 * (https://www.electronjs.org/docs/latest/tutorial/security): a strict content
 * security policy, no navigation, no new windows, no <webview>, every permission
 * request denied, and no network: the page may load only our own files (or the
 * local dev server while developing).
 */
import type { Session, WebContents } from 'electron';

/** The page's own scheme and host (appProtocol.ts serves it; kept here to avoid a cycle). */
const OWN_SCHEME = 'legwise:';
const OWN_HOST = 'app';

/**
 * The canonical content security policy. The renderer's index.html carries the same
 * string in a <meta> tag (and the shell's protocol sends it as a header); a test compares them.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

/**
 * Only our own page (legwise://app/), inline data and devtools may load — not file://,
 * so nothing on the disk is reachable from the page; http(s)/ws only from the dev server.
 */
export function isAllowedRequestUrl(url: string, devOrigin?: string): boolean {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return false;
  }
  if (parsed.protocol === OWN_SCHEME) return parsed.host === OWN_HOST;
  if (['data:', 'blob:', 'devtools:', 'chrome-extension:'].includes(parsed.protocol)) return true;
  if (devOrigin === undefined) return false;
  const dev = new URL(devOrigin);
  const sameHost = parsed.host === dev.host;
  if (parsed.protocol === dev.protocol && sameHost) return true;
  // Vite's hot-reload socket talks to the same host over ws:.
  return sameHost && parsed.protocol === (dev.protocol === 'https:' ? 'wss:' : 'ws:');
}

/** Response headers with our CSP set (replacing any the server sent, whatever its case). */
export function withCspHeader(
  headers: Record<string, string[]> | undefined,
): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const [name, value] of Object.entries(headers ?? {})) {
    if (name.toLowerCase() !== 'content-security-policy') out[name] = value;
  }
  out['Content-Security-Policy'] = [CONTENT_SECURITY_POLICY];
  return out;
}

/** Session-wide policy: deny permissions, block the network, add the CSP header. */
export function applySessionPolicy(session: Session, devOrigin?: string): void {
  session.setPermissionRequestHandler((_contents, _permission, callback) => callback(false));
  session.setPermissionCheckHandler(() => false);
  session.setDevicePermissionHandler(() => false);
  // No spell-checker dictionaries: Chromium would download them from the network.
  session.setSpellCheckerEnabled(false);
  session.webRequest.onBeforeRequest((details, callback) => {
    callback({ cancel: !isAllowedRequestUrl(details.url, devOrigin) });
  });
  session.webRequest.onHeadersReceived((details, callback) => {
    callback({ responseHeaders: withCspHeader(details.responseHeaders) });
  });
}

/**
 * Applied to every web contents the app creates (app 'web-contents-created'):
 * nothing may navigate away, open a window or attach a <webview>.
 */
export function hardenWebContents(contents: WebContents): void {
  contents.on('will-navigate', (event) => event.preventDefault());
  contents.on('will-redirect', (event) => event.preventDefault());
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
}

/** A dev server URL is trusted only if it is plain http on this machine (Vite's default). */
export function localDevServerUrl(value: string | undefined): string | undefined {
  if (!value) return undefined;
  try {
    const url = new URL(value);
    const local = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
    return url.protocol === 'http:' && local ? url.href : undefined;
  } catch {
    return undefined;
  }
}
