/**
 * The CLI's io bound to the real process: stdout/stderr, the file system (size before
 * reading, raw bytes), standard input read up to a limit, and a progress line on stderr for
 * long runs — shown after the first second, at most twice a second on a terminal (updated in
 * place) and every five seconds otherwise, so logs stay short.
 */
import {
  readdirSync,
  readFileSync,
  readSync,
  realpathSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { resolve } from 'node:path';
import type { CliIo } from './common.ts';

/** Reads standard input to its end, or until more than maxBytes have arrived. */
function readStdin(maxBytes: number): Uint8Array {
  const chunks: Buffer[] = [];
  let total = 0;
  const buf = Buffer.alloc(65536);
  for (;;) {
    let n: number;
    try {
      n = readSync(0, buf, 0, buf.length, null);
    } catch (err) {
      const code = (err as { code?: string }).code;
      if (code === 'EAGAIN') continue; // a non-blocking pipe with nothing yet: ask again
      if (code === 'EOF') break;
      throw err;
    }
    if (n === 0) break;
    chunks.push(Buffer.from(buf.subarray(0, n)));
    total += n;
    if (total > maxBytes) break;
  }
  return Buffer.concat(chunks);
}

function canonical(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return resolve(path);
  }
}

export function progressPrinter(
  isTTY: boolean,
  write: (text: string) => void,
  now: () => number = () => performance.now(),
): { progress: (done: number, total: number, what: string) => void; finish: () => void } {
  const start = now();
  let last = -Infinity;
  let shown = false;
  return {
    progress(done, total, what) {
      const t = now();
      if (t - start < 1000 || t - last < (isTTY ? 500 : 5000) || done >= total) return;
      last = t;
      const pct = Math.floor((100 * done) / total);
      const text = `legwise: ${done} of ${total} ${what} (${pct} %) — Ctrl-C stops`;
      write(isTTY ? `\r${text}\u001b[K` : `${text}\n`);
      shown = true;
    },
    finish() {
      if (shown && isTTY) write('\r\u001b[K');
    },
  };
}

export function processIo(progress?: CliIo['progress']): CliIo {
  return {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readFile: (p) => readFileSync(p, 'utf8'),
    writeFile: (p, text) => writeFileSync(p, text, 'utf8'),
    stat: (p) => {
      const s = statSync(p);
      return { size: s.size, isDirectory: s.isDirectory() };
    },
    readBytes: (p) => readFileSync(p),
    listDir: (p) => readdirSync(p),
    readStdin,
    resolvePath: canonical,
    ...(progress ? { progress } : {}),
  };
}
