import { ref, shallowRef, type Ref, type ShallowRef } from 'vue';
import type { Run } from '@shared/schemas/runs';
import { runsApi } from 'src/api/runs';
import { usePoll } from './usePoll';

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

  const poll = usePoll(async (signal) => {
    try {
      runs.value = (await runsApi.runs(options.catchmentId(), signal)).runs;
      error.value = null;
    } catch (e) {
      if (signal.aborted) return false;
      error.value = e instanceof Error ? e.message : 'The runs could not be loaded.';
    }
    return runs.value.some((r) => r.status === 'queued' || r.status === 'running');
  }, POLL_MS);

  return { runs, error, refresh: () => poll.start({ immediate: true }) };
}
