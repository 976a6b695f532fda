import { getCurrentScope, onScopeDispose, ref, shallowRef, watch, type Ref, type ShallowRef, type WatchSource } from 'vue';

export interface LatestFetch<T> {
  data: ShallowRef<T | null>;
  loading: Ref<boolean>;
  /** The last failure's message, shown in place rather than thrown into the template. */
  error: Ref<string | null>;
}

/**
 * Loads again whenever `source` changes, aborting the request still under way, so only the
 * answer for the latest choice is ever shown; the last request is aborted when the component goes.
 */
export function useLatestFetch<T>(source: WatchSource, load: (signal: AbortSignal) => Promise<T>): LatestFetch<T> {
  const data = shallowRef<T | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  watch(source, async () => {
    controller?.abort();
    const current = new AbortController();
    controller = current;
    loading.value = true;
    error.value = null;
    try {
      data.value = await load(current.signal);
    } catch (e) {
      if (current.signal.aborted) return;
      data.value = null;
      error.value = (e as Error).message;
    }
    loading.value = false;
  }, { immediate: true });

  if (getCurrentScope()) onScopeDispose(() => controller?.abort());
  return { data, loading, error };
}
