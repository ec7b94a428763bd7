/**
 * The reserve Monte Carlo, run when asked: in a Web Worker (workers/monteCarlo.ts) so the
 * page stays responsive, or — where the page cannot start a worker — on the page in short
 * slices between frames. A run remembers the plan it was made for; the profile chart draws
 * its band only while that plan is the one on screen.
 */
import { computed, inject, shallowRef, type ComputedRef, type InjectionKey, type Ref } from 'vue';
import type { Plan } from '../../../core/plan/schema.ts';
import type { PlanStore } from './usePlan.ts';
import { createConfidenceRun, type ConfidenceResult } from '../support/confidence.ts';
import type { ConfidenceMessage, ConfidenceRequest } from '../support/confidenceProtocol.ts';
import { spreadsOf, uncertaintyOf } from '../support/confidenceFields.ts';

export type ConfidenceState =
  | { kind: 'idle' }
  | { kind: 'running'; done: number; total: number; plan: Plan }
  | { kind: 'done'; result: ConfidenceResult; plan: Plan; ms: number }
  | { kind: 'error'; message: string; plan: Plan };

export interface Confidence {
  state: Ref<ConfidenceState>;
  /** The finished run for the plan on screen, or null. */
  current: ComputedRef<ConfidenceResult | null>;
  isCurrent(plan: Plan): boolean;
  run(): void;
  cancel(): void;
}

type Sink = (m: ConfidenceMessage) => void;

/** Runs in a worker; falls back to the page where a worker cannot start. Returns a stop function. */
function startWorker(request: ConfidenceRequest, sink: Sink): () => void {
  let worker: Worker;
  try {
    worker = new Worker(new URL('../workers/monteCarlo.ts', import.meta.url), { type: 'module' });
  } catch {
    return runOnPage(request, sink);
  }
  let stopFallback: (() => void) | null = null;
  let heard = false;
  worker.onmessage = (e: MessageEvent<ConfidenceMessage>) => {
    heard = true;
    sink(e.data);
    if (e.data.type !== 'progress') worker.terminate();
  };
  worker.onerror = (e) => {
    e.preventDefault();
    worker.terminate();
    // A worker that never answered could not start (file:// pages in some shells).
    if (!heard) stopFallback = runOnPage(request, sink);
    else sink({ type: 'error', message: e.message || 'the simulation stopped' });
  };
  worker.postMessage(request);
  return () => {
    worker.terminate();
    stopFallback?.();
  };
}

/** The same run on the page, a slice per timer tick. */
function runOnPage(request: ConfidenceRequest, sink: Sink): () => void {
  let stopped = false;
  let timer: ReturnType<typeof setTimeout> | undefined;
  try {
    const run = createConfidenceRun(request.plan, request.spreads, request);
    const tick = () => {
      if (stopped) return;
      try {
        if (run.step(10)) sink({ type: 'done', result: run.result() });
        else {
          sink({ type: 'progress', done: run.done, total: run.total });
          timer = setTimeout(tick, 0);
        }
      } catch (err) {
        sink({ type: 'error', message: err instanceof Error ? err.message : String(err) });
      }
    };
    timer = setTimeout(tick, 0);
  } catch (err) {
    sink({ type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
  return () => {
    stopped = true;
    clearTimeout(timer);
  };
}

export function createConfidence(store: PlanStore): Confidence {
  const state = shallowRef<ConfidenceState>({ kind: 'idle' });
  let stop: () => void = () => undefined;
  const isCurrent = (plan: Plan) => plan === store.lastValid.value && store.valid.value;

  function run(): void {
    stop();
    const plan = store.lastValid.value;
    const u = uncertaintyOf(plan);
    // A plain copy: the plan crosses to the worker by structured clone.
    const request: ConfidenceRequest = {
      plan: JSON.parse(JSON.stringify(plan)) as Plan,
      spreads: spreadsOf(u),
      samples: u.samples,
      seed: u.seed,
    };
    const t0 = performance.now();
    state.value = { kind: 'running', done: 0, total: u.samples, plan };
    const sink: Sink = (m) => {
      if (m.type === 'progress') state.value = { kind: 'running', ...m, plan };
      else if (m.type === 'done')
        state.value = { kind: 'done', result: m.result, plan, ms: performance.now() - t0 };
      else state.value = { kind: 'error', message: m.message, plan };
    };
    stop = typeof Worker === 'undefined' ? runOnPage(request, sink) : startWorker(request, sink);
  }

  return {
    state,
    current: computed(() => {
      const s = state.value;
      return s.kind === 'done' && isCurrent(s.plan) ? s.result : null;
    }),
    isCurrent,
    run,
    cancel: () => {
      stop();
      stop = () => undefined;
      state.value = { kind: 'idle' };
    },
  };
}

export const CONFIDENCE_KEY: InjectionKey<Confidence> = Symbol('confidence');

export function useConfidence(): Confidence {
  const c = inject(CONFIDENCE_KEY);
  if (!c) throw new Error('useConfidence() needs the Monte Carlo store provided by the app');
  return c;
}
