import type { PooledTask } from '../services/thread-pool';
import { surfaceResponse } from '../../shared/lab/surface-response';
import { compareMeltModels } from '../../shared/lab/reference-models';
import { evaluateDischarge, splitSample, calibrate } from '../../shared/lab/calibrate';
import { baselineMelt, cellMelt, prepareSweep, type SweepPlan, type SweepSetup } from '../../shared/lab/sweep';
import { siteWith, type CalibrationKey, type CalibrationSet } from '../../shared/lab/calibration-set';
import type { DatedValue } from '../../shared/lab/paired-series';
import { compareStakes, type StakeObservation } from '../../shared/lab/stake-balance';
import { calibrateToStakes, readingsWithin } from '../../shared/lab/stake-calibration';
import type { BandSite, LabSite, Period } from '../../shared/lab/site';
import { closeWaterBalance, type ClosureTask } from '../../shared/lab/water-balance-closure';
import { runRemoteSensing, type RemoteSensingTask } from './lab-remote-sensing';

/** The lab's computations, each run in a worker thread so the API keeps answering. */
export type LabTask =
  | { kind: 'surface'; site: BandSite }
  | { kind: 'reference'; site: BandSite }
  | { kind: 'skill'; site: LabSite; observed: DatedValue[]; period: Period }
  | { kind: 'stakes'; site: LabSite; observed: StakeObservation[] }
  | { kind: 'sweepSetup'; site: LabSite; plan: SweepPlan }
  | { kind: 'sweepCells'; setup: SweepSetup; cells: number[][] }
  | {
    kind: 'calibrate'; site: LabSite; observed: DatedValue[]; keys: CalibrationKey[]; start: CalibrationSet;
    period: Period; validationPeriod?: Period; maxEvaluations: number; seed: number;
  }
  | { kind: 'waterBalance'; site: LabSite; task: ClosureTask; maxEvaluations: number }
  | {
    kind: 'calibrateStakes'; site: LabSite; observed: StakeObservation[]; keys: CalibrationKey[]; start: CalibrationSet;
    period: Period; validationPeriod?: Period; maxEvaluations: number; seed: number;
  }
  | RemoteSensingTask;

/** The search reports the first 70 % of a calibration's progress, the behavioural-range sampling after it the rest. */
function searchProgress(report: (fraction: number) => void) {
  return {
    onProgress: (p: { evaluations: number; maxEvaluations: number }) => report(0.7 * Math.min(1, p.evaluations / p.maxEvaluations)),
    onRangeProgress: (done: number, total: number) => report(0.7 + 0.3 * (done / total)),
  };
}

function run(task: LabTask, report: (fraction: number) => void): unknown {
  switch (task.kind) {
    case 'surface':
      return surfaceResponse(task.site);
    case 'reference':
      return compareMeltModels(task.site);
    case 'skill':
      return evaluateDischarge(task.site, task.observed, task.period);
    case 'stakes':
      return compareStakes(task.site, task.observed);
    case 'sweepSetup': {
      const setup = prepareSweep(task.site, task.plan);
      return { setup, baseline: baselineMelt(setup) };
    }
    case 'sweepCells':
      return task.cells.map((values, k) => {
        const melt = cellMelt(task.setup, values);
        report((k + 1) / task.cells.length);
        return melt;
      });
    case 'calibrate': {
      const options = { keys: task.keys, period: task.period, start: task.start, maxEvaluations: task.maxEvaluations, seed: task.seed, ...searchProgress(report) };
      if (!task.validationPeriod) return { target: 'discharge', ...calibrate(task.site, task.observed, options), validation: null };
      const outcome = splitSample(task.site, task.observed, { ...options, validationPeriod: task.validationPeriod });
      return {
        target: 'discharge',
        ...outcome.calibration,
        validation: { period: task.validationPeriod, before: outcome.validationBefore, after: outcome.validationAfter },
      };
    }
    case 'waterBalance':
      // An inversion takes a few dozen engine runs; progress by runs so far, never quite done until it is.
      return closeWaterBalance(task.site, task.task, (count) => report(Math.min(0.95, count / task.maxEvaluations)));
    case 'snowCoverSkill':
    case 'geodeticSkill':
    case 'calibrateSnowCover':
    case 'calibrateGeodetic':
      return runRemoteSensing(task, report);
    case 'calibrateStakes': {
      const outcome = calibrateToStakes(task.site, task.observed, {
        keys: task.keys, period: task.period, start: task.start, maxEvaluations: task.maxEvaluations, seed: task.seed, ...searchProgress(report),
      });
      const held = task.validationPeriod ? readingsWithin(task.observed, task.validationPeriod) : [];
      const validation = task.validationPeriod && held.length > 0
        ? { period: task.validationPeriod, before: compareStakes(siteWith(task.site, task.start), held), after: compareStakes(siteWith(task.site, outcome.set), held) }
        : null;
      return { target: 'stakes', ...outcome, validation };
    }
  }
}

export default function labTask({ task, progress }: PooledTask<LabTask>): unknown {
  try {
    return run(task, (fraction) => progress.postMessage(fraction));
  } finally {
    progress.close();
  }
}

