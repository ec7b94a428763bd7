/**
 * A value that costs many solves (payload–range, optimizers): computed a moment after the
 * inputs stop changing rather than on every keystroke, and only while `active` is true.
 */
import { onBeforeUnmount, shallowRef, watch, type Ref, type WatchSource } from 'vue';

export type Deferred<T> =
  { state: 'idle' } | { state: 'ok'; value: T } | { state: 'error'; message: string };

export function useDeferred<S, T>(
  source: WatchSource<S>,
  compute: (input: S) => T,
  options: { delay_ms?: number; active?: Ref<boolean> } = {},
): Ref<Deferred<T>> {
  const out = shallowRef<Deferred<T>>({ state: 'idle' });
  let timer: ReturnType<typeof setTimeout> | undefined;
  const run = (input: S) => {
    try {
      out.value = { state: 'ok', value: compute(input) };
    } catch (err) {
      out.value = { state: 'error', message: err instanceof Error ? err.message : String(err) };
    }
  };
  const stop = watch(
    [source, () => options.active?.value ?? true] as const,
    ([input, active], old) => {
      clearTimeout(timer);
      if (!active) return;
      const firstTime = old === undefined || out.value.state === 'idle';
      if (firstTime) run(input);
      else timer = setTimeout(() => run(input), options.delay_ms ?? 250);
    },
    { immediate: true },
  );
  onBeforeUnmount(() => {
    clearTimeout(timer);
    stop();
  });
  return out;
}
