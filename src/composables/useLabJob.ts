import { onBeforeUnmount, ref, shallowRef } from 'vue';
import type { z } from 'zod';
import type { LabJob } from '@shared/schemas/lab';
import { labApi } from 'src/api/lab';

const POLL_MS = 500;

/**
 * Follows one lab job (sweep or calibration): starts it, polls its progress until it ends,
 * cancels it, and parses its result with the given schema. Errors land in `error`.
 */
export function useLabJob<S extends z.ZodType>(options: { resultSchema: S }) {
  const job = shallowRef<LabJob | null>(null);
  const result = shallowRef<z.infer<S> | null>(null);
  const error = ref<string | null>(null);
  let timer: ReturnType<typeof setTimeout> | undefined;

  const running = () => job.value?.status === 'running' || job.value?.status === 'queued';

  async function poll(): Promise<void> {
    if (!job.value) return;
    try {
      job.value = await labApi.job(job.value.id);
    } catch {
      error.value = 'Lost track of the job; reload the page to see it again.';
      return;
    }
    if (running()) {
      timer = setTimeout(() => void poll(), POLL_MS);
      return;
    }
    if (job.value.status === 'done') {
      const parsed = options.resultSchema.safeParse(job.value.result);
      if (parsed.success) result.value = parsed.data;
      else error.value = 'The job finished with a result this page does not understand.';
    } else {
      error.value = job.value.error ?? `The job ${job.value.status}.`;
    }
  }

  async function start(begin: () => Promise<LabJob>): Promise<void> {
    clearTimeout(timer);
    error.value = null;
    result.value = null;
    try {
      job.value = await begin();
    } catch (e) {
      error.value = e instanceof Error ? e.message : 'The job could not start.';
      return;
    }
    timer = setTimeout(() => void poll(), POLL_MS);
  }

  /** Shows the newest job of this kind for the catchment (following it if it still runs), e.g. after coming back to the page. */
  async function resume(catchmentId: number, kind: LabJob['kind']): Promise<void> {
    clearTimeout(timer);
    const newest = (await labApi.jobs(catchmentId)).jobs.find((j) => j.kind === kind);
    job.value = newest ?? null;
    result.value = null;
    error.value = null;
    if (newest && newest.status !== 'cancelled') await poll();
  }

  async function cancel(): Promise<void> {
    if (!job.value || !running()) return;
    clearTimeout(timer);
    job.value = await labApi.cancelJob(job.value.id);
    error.value = job.value.error;
  }

  onBeforeUnmount(() => clearTimeout(timer));
  return { job, result, error, start, cancel, resume, running };
}
