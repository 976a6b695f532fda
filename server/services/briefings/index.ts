import type { InvitationService } from '../members/invitation-service';
import type { ResultsService } from '../runs/results-service';
import type { StudyResults } from '../studies/study-results';
import type { ThreadBudget } from '../thread-budget';
import type { MailService } from '../mail/mail-service';
import { BriefingExports } from './briefing-exports';
import { BriefingNotices } from './briefing-notices';
import { BriefingService } from './briefing-service';
import { BriefingSharing } from './briefing-sharing';
import type { BriefingResultsSource } from './comparison';
import { PdfPool } from './pdf/pdf-pool';
import { RunsResultsSource } from './runs-results-source';

export interface BriefingServices {
  briefings: BriefingService;
  briefingSharing: BriefingSharing;
  /** Mails to clients when a briefing is shared with them or a new version is published. */
  briefingNotices: BriefingNotices;
  briefingExports: BriefingExports;
  /** The worker thread that lays out PDFs, on the shared thread budget. */
  pdfPool: PdfPool;
}

export interface BriefingServicesDeps {
  results: ResultsService;
  /** Regional results, for regional sections. */
  studyResults: StudyResults;
  invitations: InvitationService;
  mail: MailService;
  publicUrl: () => string;
  threads: ThreadBudget;
  /** Where briefing numbers come from; finished runs unless given. */
  briefingResults?: BriefingResultsSource;
}

/** Briefings, their sharing and comments, and their PDF and CSV exports. */
export function createBriefingServices(deps: BriefingServicesDeps): BriefingServices {
  const briefings = new BriefingService(deps.briefingResults ?? new RunsResultsSource(deps.results), (scope, studyId) => deps.studyResults.results(scope, studyId));
  const pdfPool = new PdfPool(deps.threads);
  const briefingNotices = new BriefingNotices(deps.mail, deps.publicUrl);
  return {
    briefings, briefingSharing: new BriefingSharing(deps.invitations, briefingNotices), briefingNotices,
    briefingExports: new BriefingExports(briefings, pdfPool), pdfPool,
  };
}
