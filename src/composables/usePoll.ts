import { getCurrentScope, onScopeDispose, ref, type Ref } from 'vue';

export interface Poll {
  /** True from `start` until a tick says to stop, `stop` is called or the scope is gone. */
  active: Ref<boolean>;
  /** (Re)starts polling: the first tick at once with `immediate`, else after one interval; resolves after that first tick. */
  start(options?: { immediate?: boolean }): Promise<void>;
  /** Stops polling and aborts the tick under way. */
  stop(): void;
}

/**
 * Calls `tick` again `intervalMs` after each call has finished, for as long as it answers true,
 * as VueUse's `useTimeoutPoll` does. Polling ends for good when the component (its effect scope)
 * is disposed, even while a tick is under way: the tick's signal aborts and no further tick is
 * scheduled, so nothing keeps polling after its page is gone.
 */
export function usePoll(tick: (signal: AbortSignal) => Promise<boolean>, intervalMs: number): Poll {
  const active = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;
  let controller: AbortController | null = null;
  let generation = 0;
  let disposed = false;

  function stop(): void {
    generation += 1;
    clearTimeout(timer);
    controller?.abort();
    controller = null;
    active.value = false;
  }

  async function run(current: number): Promise<void> {
    if (current !== generation) return;
    const own = new AbortController();
    controller = own;
    // A tick that throws ends the polling, as one that answers false.
    const again = await tick(own.signal).catch(() => false);
    if (current !== generation) return;
    controller = null;
    if (again) timer = setTimeout(() => void run(current), intervalMs);
    else active.value = false;
  }

  async function start(options: { immediate?: boolean } = {}): Promise<void> {
    stop();
    if (disposed) return;
    active.value = true;
    const current = generation;
    if (options.immediate) await run(current);
    else timer = setTimeout(() => void run(current), intervalMs);
  }

  if (getCurrentScope()) {
    onScopeDispose(() => {
      disposed = true;
      stop();
    });
  }
  return { active, start, stop };
}
