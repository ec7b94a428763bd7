/**
 * Reading a GPX file for the route editor without blocking the page: a worker
 * (workers/gpxImport.ts) reads and parses the file and reports progress; `cancel` stops it.
 * Where a worker cannot start, the file is parsed on the page instead.
 */
import { parseGpx, type GpxParseResult } from '../../../core/route/gpx.ts';

export type GpxImportMessage =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; result: GpxParseResult }
  | { type: 'error'; message: string };

export interface GpxImport {
  /** The parse result, or null when cancelled. */
  done: Promise<GpxParseResult | null>;
  cancel(): void;
}

export function importGpx(file: Blob, onProgress: (fraction: number) => void): GpxImport {
  let settle: (r: GpxParseResult | null) => void = () => undefined;
  let fail: (e: Error) => void = () => undefined;
  const done = new Promise<GpxParseResult | null>((resolve, reject) => {
    settle = resolve;
    fail = reject;
  });
  let worker: Worker | null = null;
  let heard = false;
  let cancelled = false;
  const onPage = () => {
    void file.text().then((text) => {
      if (!cancelled) settle(parseGpx(text, { onProgress }));
    }, fail);
  };
  try {
    worker = new Worker(new URL('../workers/gpxImport.ts', import.meta.url), { type: 'module' });
  } catch {
    onPage();
    return { done, cancel: () => ((cancelled = true), settle(null)) };
  }
  worker.onmessage = (e: MessageEvent<GpxImportMessage>) => {
    heard = true;
    const m = e.data;
    if (m.type === 'progress') onProgress(m.fraction);
    else {
      worker?.terminate();
      if (m.type === 'done') settle(m.result);
      else fail(new Error(m.message));
    }
  };
  worker.onerror = (e) => {
    e.preventDefault();
    worker?.terminate();
    // A worker that never answered could not start (file:// pages in some shells).
    if (!heard && !cancelled) onPage();
    else fail(new Error(e.message || 'the GPX import stopped'));
  };
  worker.postMessage({ file });
  return {
    done,
    cancel: () => {
      cancelled = true;
      worker?.terminate();
      settle(null);
    },
  };
}
