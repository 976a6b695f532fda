import type { Knex } from 'knex';
import type { Logger } from '../../logger';
import type { GeodataServices } from '../geodata';
import type { RunServices } from '../runs';
import { OutlineBatches } from './outline-batches';
import { OutlineDerivation } from './outline-derivation';
import { PendingBatchFiles } from './pending-batch-files';
import { StudyResults } from './study-results';
import { StudyService } from './study-service';

export interface StudyServices {
  studies: StudyService;
  studyResults: StudyResults;
  /** Many catchments of a study from outlines over one DEM: read, derived in the background, confirmed. */
  outlineBatches: OutlineBatches;
}

/** Regional studies: catchments × scenario templates run through the queue, their regional totals, and catchments made in bulk. */
export function createStudyServices(deps: Pick<RunServices, 'scenarios' | 'runs'> & GeodataServices & { db: Knex; logger: Logger }): StudyServices {
  const studies = new StudyService(deps.scenarios, deps.runs);
  const files = new PendingBatchFiles(deps.geodata.store);
  return {
    studies,
    studyResults: new StudyResults(studies),
    outlineBatches: new OutlineBatches(deps.geodata.pool, files, new OutlineDerivation(deps.db, deps.geodata.pool, files, deps.logger), studies),
  };
}
