import type { RunServices } from '../runs';
import { StudyResults } from './study-results';
import { StudyService } from './study-service';

export interface StudyServices {
  studies: StudyService;
  studyResults: StudyResults;
}

/** Regional studies: catchments × scenario templates run through the queue, and their regional totals. */
export function createStudyServices(deps: Pick<RunServices, 'scenarios' | 'runs'>): StudyServices {
  const studies = new StudyService(deps.scenarios, deps.runs);
  return { studies, studyResults: new StudyResults(studies) };
}
