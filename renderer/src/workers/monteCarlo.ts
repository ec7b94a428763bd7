/**
 * The reserve Monte Carlo off the page's main thread: receives a plan, its spreads, the
 * number of samples and the random seed; answers with progress and then the result
 * (support/confidence.ts). Same inputs, same answer: everything follows from the random seed.
 */
import { createConfidenceRun } from '../support/confidence.ts';
import type { ConfidenceRequest, ConfidenceMessage } from '../support/confidenceProtocol.ts';

const SLICE = 25;
const scope = self as unknown as {
  onmessage: ((e: MessageEvent<ConfidenceRequest>) => void) | null;
  postMessage(message: ConfidenceMessage): void;
};

scope.onmessage = (e) => {
  const { plan, spreads, samples, seed } = e.data;
  try {
    const run = createConfidenceRun(plan, spreads, { samples, seed });
    while (!run.step(SLICE))
      scope.postMessage({ type: 'progress', done: run.done, total: run.total });
    scope.postMessage({ type: 'done', result: run.result() });
  } catch (err) {
    scope.postMessage({ type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
};
