import type { Knex } from 'knex';
import type { Logger } from '../../logger';
import type { GeodataServices } from '../geodata';
import type { RunServices } from '../runs';
import { OutlineBatches } from './outline-batches';
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
  return {
    studies,
    studyResults: new StudyResults(studies),
    outlineBatches: new OutlineBatches(deps.db, deps.geodata, studies, deps.logger),
  };
}
