import type TestAgent from 'supertest/lib/agent';
import { labJobSchema, type LabJob } from '../../shared/schemas/lab';

/** Polls a lab job until it has finished (done, failed or cancelled). */
export async function waitForJob(agent: TestAgent, id: number, timeoutMs = 120_000): Promise<LabJob> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/lab/jobs/${id}`);
    const job = labJobSchema.parse(res.body);
    if (job.status !== 'running' && job.status !== 'queued') return job;
    if (Date.now() > until) throw new Error(`lab job ${id} still ${job.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
