import { onBeforeUnmount, ref, shallowRef, type Ref, type ShallowRef } from 'vue';
import type { Run } from '@shared/schemas/runs';
import { runsApi } from 'src/api/runs';

const POLL_MS = 1000;

export interface RunList {
  runs: ShallowRef<Run[]>;
  error: Ref<string | null>;
  refresh(): Promise<void>;
}

/**
 * A catchment's runs, read from the server and read again every second while any is queued or
 * running, so progress shows live and survives a page reload (the server keeps the state).
 */
export function useRunList(options: { catchmentId: () => number }): RunList {
  const runs = shallowRef<Run[]>([]);
  const error = ref<string | null>(null);
  let timer: ReturnType<typeof setTimeout> | undefined;
  let stopped = false;

  async function refresh(): Promise<void> {
    clearTimeout(timer);
    try {
      runs.value = (await runsApi.runs(options.catchmentId())).runs;
      error.value = null;
    } catch (e) {
      error.value = e instanceof Error ? e.message : 'The runs could not be loaded.';
    }
    if (!stopped && runs.value.some((r) => r.status === 'queued' || r.status === 'running')) {
      timer = setTimeout(() => void refresh(), POLL_MS);
    }
  }

  onBeforeUnmount(() => {
    stopped = true;
    clearTimeout(timer);
  });
  return { runs, error, refresh };
}
