import { ref, shallowRef } from 'vue';
import type { z } from 'zod';
import type { LabJob } from '@shared/schemas/lab';
import { labApi } from 'src/api/lab';
import { usePoll } from './usePoll';

const POLL_MS = 500;

/**
 * Follows one lab job (sweep or calibration): starts it, polls its progress until it ends (or the
 * component is gone), cancels it, and parses its result with the given schema. Errors land in `error`.
 */
export function useLabJob<S extends z.ZodType>(options: { resultSchema: S }) {
  const job = shallowRef<LabJob | null>(null);
  const result = shallowRef<z.infer<S> | null>(null);
  const error = ref<string | null>(null);

  const running = () => job.value?.status === 'running' || job.value?.status === 'queued';

  function settle(ended: LabJob): void {
    if (ended.status === 'done') {
      const parsed = options.resultSchema.safeParse(ended.result);
      if (parsed.success) result.value = parsed.data;
      else error.value = 'The job finished with a result this page does not understand.';
    } else {
      error.value = ended.error ?? `The job ${ended.status}.`;
    }
  }

  const poll = usePoll(async (signal) => {
    if (!job.value) return false;
    try {
      job.value = await labApi.job(job.value.id, signal);
    } catch {
      if (!signal.aborted) error.value = 'Lost track of the job; reload the page to see it again.';
      return false;
    }
    if (running()) return true;
    settle(job.value);
    return false;
  }, POLL_MS);

  async function start(begin: () => Promise<LabJob>): Promise<void> {
    poll.stop();
    error.value = null;
    result.value = null;
    try {
      job.value = await begin();
    } catch (e) {
      error.value = e instanceof Error ? e.message : 'The job could not start.';
      return;
    }
    await poll.start();
  }

  /** Shows the newest job of this kind for the catchment (following it if it still runs), e.g. after coming back to the page. */
  async function resume(catchmentId: number, kind: LabJob['kind']): Promise<void> {
    poll.stop();
    const newest = (await labApi.jobs(catchmentId)).jobs.find((j) => j.kind === kind);
    job.value = newest ?? null;
    result.value = null;
    error.value = null;
    if (newest && newest.status !== 'cancelled') await poll.start({ immediate: true });
  }

  async function cancel(): Promise<void> {
    if (!job.value || !running()) return;
    poll.stop();
    job.value = await labApi.cancelJob(job.value.id);
    error.value = job.value.error;
  }

  return { job, result, error, start, cancel, resume, running };
}
