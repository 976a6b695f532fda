import type TestAgent from 'supertest/lib/agent';
import { expect } from 'vitest';
import type { DraftSection } from '../../shared/schemas/briefings';
import { createCatchment, SEASON, waitForRun } from './runs';

/** A catchment with a finished variant run (black carbon on snow and ice), through the API. */
export async function catchmentWithRun(consultant: TestAgent): Promise<{ catchmentId: number; runId: number }> {
  const catchmentId = await createCatchment(consultant);
  const list = await consultant.get(`/api/catchments/${catchmentId}/scenarios`);
  const baselineId = list.body.scenarios[0].id as number;
  await consultant.patch(`/api/catchments/${catchmentId}/scenarios/${baselineId}`).send({ changes: { period: SEASON } });
  const scenario = await consultant.post(`/api/catchments/${catchmentId}/scenarios`)
    .send({ name: 'Soot 400 ng/g', changes: { period: SEASON, blackCarbonSnowNgG: 400, blackCarbonIceNgG: 1500 } });
  expect(scenario.status).toBe(201);
  const started = await consultant.post(`/api/catchments/${catchmentId}/runs`).send({ scenarioId: scenario.body.scenario.id });
  expect(started.status).toBe(202);
  const run = await waitForRun(consultant, catchmentId, started.body.run.id);
  expect(run.status).toBe('done');
  return { catchmentId, runId: run.id };
}

export const SECTIONS: DraftSection[] = [
  { kind: 'chart', heading: 'Added runoff by month', caption: 'Most added water arrives in July.', contentKey: 'monthly-added-melt' },
  { kind: 'table', heading: 'Totals', caption: '', contentKey: 'totals' },
  { kind: 'text', heading: 'Notes', bodyMarkdown: 'Read with care. <script>alert(1)</script><img src=x onerror=alert(2)> [x](javascript:alert(3))' },
];
