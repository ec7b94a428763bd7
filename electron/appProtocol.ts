/**
 * The page's own origin, `legwise://app/`, served by the shell through
 * `protocol.handle` instead of `file://` (Electron security checklist: "use a custom
 * protocol instead of file://"): only files inside dist/ answer, with our CSP header,
 * and with the file-protocol fuse off (build/electron-builder.json) the page gets no
 * file:// privileges at all. Pure functions over a read callback, so tests run in Node.
 */
import path from 'node:path';
import { CONTENT_SECURITY_POLICY } from './security.ts';

export const APP_SCHEME = 'legwise';
export const APP_HOST = 'app';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_INDEX_URL = `${APP_ORIGIN}/index.html`;

/** For protocol.registerSchemesAsPrivileged, before the app is ready. */
export const APP_SCHEME_PRIVILEGES = {
  scheme: APP_SCHEME,
  privileges: { standard: true, secure: true, supportFetchAPI: true, codeCache: true },
} as const;

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.txt': 'text/plain; charset=utf-8',
};

export function mimeOf(file: string): string {
  return MIME[path.extname(file).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The file under `distDir` a request URL names, or null for anything else: another
 * scheme or host, a path leaving dist/ (`..`, encoded or not), a NUL byte.
 */
export function resolveAppRequest(url: string, distDir: string): string | null {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return null;
  }
  if (parsed.protocol !== `${APP_SCHEME}:` || parsed.host !== APP_HOST) return null;
  let pathname: string;
  try {
    pathname = decodeURIComponent(parsed.pathname);
  } catch {
    return null;
  }
  if (pathname.includes('\0') || pathname.includes('\\')) return null;
  const relative = pathname === '/' ? 'index.html' : pathname.replace(/^\/+/, '');
  const root = path.resolve(distDir);
  const file = path.resolve(root, relative);
  return file.startsWith(root + path.sep) ? file : null;
}

export type ReadFile = (file: string) => Promise<Uint8Array>;

/** The handler given to `protocol.handle(APP_SCHEME, …)`. */
export function appProtocolHandler(distDir: string, readFile: ReadFile) {
  return async (request: { url: string; method?: string }): Promise<Response> => {
    if (request.method !== undefined && request.method !== 'GET' && request.method !== 'HEAD')
      return new Response('Method not allowed', { status: 405 });
    const file = resolveAppRequest(request.url, distDir);
    if (file === null) return new Response('Not found', { status: 404 });
    let body: Uint8Array;
    try {
      body = await readFile(file);
    } catch {
      return new Response('Not found', { status: 404 });
    }
    return new Response(body as BodyInit, {
      status: 200,
      headers: {
        'Content-Type': mimeOf(file),
        'Content-Security-Policy': CONTENT_SECURITY_POLICY,
        'X-Content-Type-Options': 'nosniff',
      },
    });
  };
}
