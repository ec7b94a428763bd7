/**
 * GPX import off the page's main thread: receives the chosen file, reads its text and parses
 * it in one pass (core/route/gpx.ts), answering with progress (fraction of the text read)
 * and then the result. The page stops it with terminate() when the user cancels.
 */
import { parseGpx } from '../../../core/route/gpx.ts';
import type { GpxImportMessage } from '../support/gpxImport.ts';

const scope = self as unknown as {
  onmessage: ((e: MessageEvent<{ file: Blob }>) => void) | null;
  postMessage(message: GpxImportMessage): void;
};

scope.onmessage = async (e) => {
  try {
    const text = await e.data.file.text();
    const result = parseGpx(text, {
      onProgress: (fraction) => scope.postMessage({ type: 'progress', fraction }),
    });
    scope.postMessage({ type: 'done', result });
  } catch (err) {
    scope.postMessage({ type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
};
