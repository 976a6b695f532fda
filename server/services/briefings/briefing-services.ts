import type { InvitationService } from '../members/invitation-service';
import type { ResultsService } from '../runs/results-service';
import { BriefingExports } from './briefing-exports';
import { BriefingService } from './briefing-service';
import { BriefingSharing } from './briefing-sharing';
import { PdfPool } from './pdf/pdf-pool';
import type { BriefingResultsSource } from './comparison';
import { RunsResultsSource } from './runs-results-source';

/** Briefings, their sharing and comments, and their exports: the part of the context they need. */
export interface BriefingServices {
  briefings: BriefingService;
  briefingSharing: BriefingSharing;
  briefingExports: BriefingExports;
  /** The worker thread that lays out PDFs; close it when the app stops. */
  pdfPool: PdfPool;
}

export interface BriefingServicesOptions {
  /** Where briefing numbers come from; finished runs unless a test gives its own. */
  briefingResults?: BriefingResultsSource;
}

export function createBriefingServices(
  deps: { results: ResultsService; invitations: InvitationService }, options: BriefingServicesOptions = {},
): BriefingServices {
  const briefings = new BriefingService(options.briefingResults ?? new RunsResultsSource(deps.results));
  const pdfPool = new PdfPool();
  return { briefings, briefingSharing: new BriefingSharing(deps.invitations), briefingExports: new BriefingExports(briefings, pdfPool), pdfPool };
}
