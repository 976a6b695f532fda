import { z } from 'zod';
import {
  calibrationHistorySchema, labJobSchema, referenceModelsSchema, savedCalibrationSchema, skillReplySchema, stakeSkillReplySchema, surfaceResponseSchema,
  type CalibrateRequest, type CalibrationSetInput, type LabPeriod, type SweepRequest,
} from '@shared/schemas/lab';
import { closureHistorySchema, savedClosureSchema, type WaterBalanceRequestInput } from '@shared/schemas/water-balance';
import { geodeticSkillReplySchema, snowCoverSkillReplySchema } from '@shared/schemas/lab-remote-sensing';
import { api } from './http';

const base = (id: number) => `/api/lab/catchments/${id}`;
const bandQuery = (band: number, period: LabPeriod) => new URLSearchParams({ band: String(band), from: period.from, to: period.to }).toString();

/** Typed calls for the lab. */
export const labApi = {
  surfaceResponse: (id: number, band: number, period: LabPeriod, signal?: AbortSignal) =>
    api.get(`${base(id)}/surface-response?${bandQuery(band, period)}`, surfaceResponseSchema, { signal }),
  referenceModels: (id: number, band: number, period: LabPeriod, signal?: AbortSignal) =>
    api.get(`${base(id)}/reference-models?${bandQuery(band, period)}`, referenceModelsSchema, { signal }),
  skill: (id: number, period: LabPeriod, set?: CalibrationSetInput) => api.post(`${base(id)}/skill`, { period, set }, { schema: skillReplySchema }),
  stakeSkill: (id: number, set?: CalibrationSetInput) => api.post(`${base(id)}/stake-skill`, { set }, { schema: stakeSkillReplySchema, quiet: true }),
  snowCoverSkill: (id: number, set?: CalibrationSetInput) => api.post(`${base(id)}/snow-cover-skill`, { set }, { schema: snowCoverSkillReplySchema, quiet: true }),
  geodeticSkill: (id: number, set?: CalibrationSetInput) => api.post(`${base(id)}/geodetic-skill`, { set }, { schema: geodeticSkillReplySchema, quiet: true }),
  calibration: (id: number) => api.get(`${base(id)}/calibration`, calibrationHistorySchema),
  saveCalibration: (id: number, period: LabPeriod, set: CalibrationSetInput, note: string) =>
    api.put(`${base(id)}/calibration`, { period, set, note }, { schema: savedCalibrationSchema }),
  startSweep: (id: number, request: SweepRequest) => api.post(`${base(id)}/sweeps`, request, { schema: labJobSchema }),
  startCalibration: (id: number, request: CalibrateRequest) => api.post(`${base(id)}/calibrations`, request, { schema: labJobSchema }),
  job: (jobId: number, signal?: AbortSignal) => api.get(`/api/lab/jobs/${jobId}`, labJobSchema, { quiet: true, signal }),
  cancelJob: (jobId: number) => api.post(`/api/lab/jobs/${jobId}/cancel`, undefined, { schema: labJobSchema }),
  jobs: (id: number) => api.get(`${base(id)}/jobs`, z.object({ jobs: z.array(labJobSchema) })),
  startWaterBalance: (id: number, request: WaterBalanceRequestInput) => api.post(`${base(id)}/water-balance`, request, { schema: labJobSchema, quiet: true }),
  closures: (id: number) => api.get(`${base(id)}/water-balance`, closureHistorySchema),
  keepClosure: (id: number, jobId: number, note: string) => api.put(`${base(id)}/water-balance`, { jobId, note }, { schema: savedClosureSchema }),
  closureCsvUrl: (id: number) => `${base(id)}/water-balance.csv`,
};
