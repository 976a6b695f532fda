import { z } from 'zod';
import {
  scenarioListSchema, scenarioReplySchema, scenarioSetupSchema, type ScenarioCreate, type ScenarioUpdate,
} from '@shared/schemas/scenarios';
import { runListSchema, runReplySchema, type StartRun } from '@shared/schemas/runs';
import { runResultsReplySchema } from '@shared/schemas/results';
import { transientResultsReplySchema } from '@shared/schemas/transient-results';
import { waterInputsSchema } from '@shared/schemas/water-inputs';
import { api } from './http';

const base = (catchmentId: number) => `/api/catchments/${catchmentId}`;

/** Stored catchment, forcing and water side for the builder's preview; the engine validates them when it runs. */
const previewInputSchema = z.object({ catchment: z.record(z.string(), z.unknown()), forcing: z.record(z.string(), z.unknown()), water: waterInputsSchema });
export type PreviewInput = z.infer<typeof previewInputSchema>;

/** Typed calls for scenarios, runs and results of one catchment. */
export const runsApi = {
  scenarios: (catchmentId: number, archived = false) => api.get(`${base(catchmentId)}/scenarios?archived=${archived}`, scenarioListSchema),
  scenario: (catchmentId: number, id: number) => api.get(`${base(catchmentId)}/scenarios/${id}`, scenarioReplySchema),
  createScenario: (catchmentId: number, body: ScenarioCreate) =>
    api.post(`${base(catchmentId)}/scenarios`, body, { schema: scenarioReplySchema, quiet: true }),
  updateScenario: (catchmentId: number, id: number, body: ScenarioUpdate, quiet = true) =>
    api.patch(`${base(catchmentId)}/scenarios/${id}`, body, { schema: scenarioReplySchema, quiet }),
  duplicateScenario: (catchmentId: number, id: number) => api.post(`${base(catchmentId)}/scenarios/${id}/duplicate`, undefined, { schema: scenarioReplySchema }),
  setup: (catchmentId: number) => api.get(`${base(catchmentId)}/scenario-setup`, scenarioSetupSchema),
  previewInput: (catchmentId: number, period: { from: string; to: string }) =>
    api.get(`${base(catchmentId)}/preview-input?${new URLSearchParams(period).toString()}`, previewInputSchema, { quiet: true }),
  runs: (catchmentId: number, signal?: AbortSignal) => api.get(`${base(catchmentId)}/runs`, runListSchema, { signal }),
  startRun: (catchmentId: number, body: StartRun) => api.post(`${base(catchmentId)}/runs`, body, { schema: runReplySchema }),
  cancelRun: (catchmentId: number, id: number) => api.post(`${base(catchmentId)}/runs/${id}/cancel`, undefined, { schema: runReplySchema }),
  results: (catchmentId: number, id: number) => api.get(`${base(catchmentId)}/runs/${id}/results`, runResultsReplySchema),
  years: (catchmentId: number, id: number) => api.get(`${base(catchmentId)}/runs/${id}/years`, transientResultsReplySchema),
  exportUrl: (catchmentId: number, id: number, file: 'bands.csv' | 'daily.csv' | 'years.csv') => `${base(catchmentId)}/runs/${id}/export/${file}`,
};
