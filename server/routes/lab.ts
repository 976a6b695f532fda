import { z } from 'zod';
import {
  bandQuerySchema, calibrateRequestSchema, saveCalibrationSchema, skillRequestSchema, stakeSkillRequestSchema, sweepRequestSchema,
} from '../../shared/schemas/lab';
import { saveClosureSchema, waterBalanceRequestSchema } from '../../shared/schemas/water-balance';
import { remoteSensingSkillRequestSchema } from '../../shared/schemas/lab-remote-sensing';
import type { AppContext } from '../context';
import { sendDownload } from './download';
import { requireActiveSubscription } from '../middleware/require-active-subscription';
import { idOf, memberArea, type ApiArea } from './route-table';

const params = z.object({ catchmentId: idOf('Catchment') });
const jobParams = z.object({ jobId: idOf('Lab job') });

/** /api/lab: surface response, reference models, skill, calibration and sweeps per catchment. */
export function labRoutes(ctx: AppContext): ApiArea {
  const { lab, waterBalance } = ctx;
  // Sweeps and automatic calibrations are paid work, like runs; reading and scoring stay open.
  const paid = [requireActiveSubscription(ctx)];
  return memberArea('/lab', (route) => {
    route.get('/catchments/:catchmentId/surface-response', 'useLab', { params, query: bandQuerySchema }, async ({ auth: { scope }, params, query }, res) => {
      res.json(await lab.surfaceResponse(scope, params.catchmentId, query));
    });

    route.get('/catchments/:catchmentId/reference-models', 'useLab', { params, query: bandQuerySchema }, async ({ auth: { scope }, params, query }, res) => {
      res.json(await lab.referenceModels(scope, params.catchmentId, query));
    });

    route.post('/catchments/:catchmentId/skill', 'useLab', { params, body: skillRequestSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json(await lab.skill(scope, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/stake-skill', 'useLab', { params, body: stakeSkillRequestSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json(await lab.stakeSkill(scope, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/snow-cover-skill', 'useLab', { params, body: remoteSensingSkillRequestSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json(await lab.remoteSensing.snowCoverSkill(scope, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/geodetic-skill', 'useLab', { params, body: remoteSensingSkillRequestSchema }, async ({ auth: { scope }, params, body }, res) => {
      res.json(await lab.remoteSensing.geodeticSkill(scope, params.catchmentId, body));
    });

    route.get('/catchments/:catchmentId/calibration', 'useLab', { params }, async ({ auth: { scope }, params }, res) => {
      res.json(await lab.calibrationHistory(scope, params.catchmentId));
    });

    route.put('/catchments/:catchmentId/calibration', 'useLab', { params, body: saveCalibrationSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(201).json(await lab.saveCalibration(scope, user, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/sweeps', 'useLab', { params, before: paid, body: sweepRequestSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(202).json(await lab.startSweep(scope, user, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/calibrations', 'useLab', { params, before: paid, body: calibrateRequestSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(202).json(await lab.startCalibration(scope, user, params.catchmentId, body));
    });

    route.post('/catchments/:catchmentId/water-balance', 'useLab', { params, before: paid, body: waterBalanceRequestSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(202).json(await waterBalance.start(scope, user, params.catchmentId, body));
    });

    route.get('/catchments/:catchmentId/water-balance', 'useLab', { params }, async ({ auth: { scope }, params }, res) => {
      res.json(await waterBalance.history(scope, params.catchmentId));
    });

    // Kept closures change what scenarios with the water-balance precipitation run on, as saved calibrations do.
    route.put('/catchments/:catchmentId/water-balance', 'useLab', { params, body: saveClosureSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.status(201).json(await waterBalance.save(scope, user, params.catchmentId, body.jobId, body.note));
    });

    route.get('/catchments/:catchmentId/water-balance.csv', 'useLab', { params }, async ({ auth: { scope }, params }, res) => {
      sendDownload(res, await waterBalance.csvFile(scope, params.catchmentId));
    });

    route.get('/catchments/:catchmentId/jobs', 'useLab', { params }, async ({ auth: { scope }, params }, res) => {
      res.json({ jobs: await lab.jobList(scope, params.catchmentId) });
    });

    route.get('/jobs/:jobId', 'useLab', { params: jobParams }, async ({ auth: { scope }, params }, res) => {
      res.json(await lab.jobs.get(scope, params.jobId));
    });

    route.post('/jobs/:jobId/cancel', 'useLab', { params: jobParams }, async ({ auth: { scope }, params }, res) => {
      res.json(await lab.jobs.cancel(scope, params.jobId));
    });
  });
}
