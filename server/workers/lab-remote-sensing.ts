import type { CalibrationKey, CalibrationSet } from '../../shared/lab/calibration-set';
import { compareGeodetic, type GeodeticObservation } from '../../shared/lab/geodetic-skill';
import { calibrateToGeodetic, calibrateToSnowCover } from '../../shared/lab/remote-sensing-calibration';
import type { LabSite } from '../../shared/lab/site';
import { compareSnowCover, type SnowCoverObservation } from '../../shared/lab/snow-cover-skill';

interface Search { keys: CalibrationKey[]; start: CalibrationSet; maxEvaluations: number; seed: number }

/** The lab's computations against remote sensing (snow-cover maps, geodetic balance), run in the lab's worker threads. */
export type RemoteSensingTask =
  | { kind: 'snowCoverSkill'; site: LabSite; observed: SnowCoverObservation[] }
  | { kind: 'geodeticSkill'; site: LabSite; observed: GeodeticObservation[] }
  | ({ kind: 'calibrateSnowCover'; site: LabSite; observed: SnowCoverObservation[] } & Search)
  | ({ kind: 'calibrateGeodetic'; site: LabSite; observed: GeodeticObservation[] } & Search);

export function runRemoteSensing(task: RemoteSensingTask, report: (fraction: number) => void): unknown {
  const search = (t: Search) => ({
    keys: t.keys, start: t.start, maxEvaluations: t.maxEvaluations, seed: t.seed,
    onProgress: (p: { evaluations: number; maxEvaluations: number }) => report(Math.min(1, p.evaluations / p.maxEvaluations)),
  });
  switch (task.kind) {
    case 'snowCoverSkill':
      return compareSnowCover(task.site, task.observed);
    case 'geodeticSkill':
      return compareGeodetic(task.site, task.observed);
    case 'calibrateSnowCover':
      return calibrateToSnowCover(task.site, task.observed, search(task));
    case 'calibrateGeodetic':
      return calibrateToGeodetic(task.site, task.observed, search(task));
  }
}
