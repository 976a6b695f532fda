import type { Queue } from 'bullmq';
import { JOB_OPTIONS, memberJobId, PRIORITY, type JobPriority, type MemberJobData } from './jobs';

/** Adds one job per member of a run; adding them again (recovery) leaves existing ones as they are. */
export async function addMemberJobs(queue: Queue<MemberJobData>, run: { runId: number; organisationId: number; memberCount: number; priority: JobPriority }): Promise<void> {
  const jobs = Array.from({ length: run.memberCount }, (_, memberIndex) => ({
    name: 'member',
    data: { runId: run.runId, organisationId: run.organisationId, memberIndex },
    opts: { ...JOB_OPTIONS, jobId: memberJobId(run.runId, memberIndex), priority: PRIORITY[run.priority] },
  }));
  // In slices: one call per few hundred jobs keeps each Redis script short.
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
}

const IDLE_STATES = new Set(['waiting', 'prioritized', 'delayed']);

/**
 * Removes a run's jobs that wait to be worked on; a job a worker holds stays (it is locked) and is
 * stopped through the cancel channel instead, and a failed one stays for the queue page.
 */
export async function removeIdleMemberJobs(queue: Queue<MemberJobData>, runId: number, memberCount: number): Promise<void> {
  for (let i = 0; i < memberCount; i += 50) {
    const slice = Array.from({ length: Math.min(50, memberCount - i) }, (_, k) => memberJobId(runId, i + k));
    await Promise.all(slice.map(async (jobId) => {
      if (IDLE_STATES.has(await queue.getJobState(jobId))) await queue.remove(jobId).catch(() => 0);
    }));
  }
}
