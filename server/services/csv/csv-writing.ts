/** Server-side path of the shared CSV writer (briefing exports import it from here). */
export { csvCell, csvLine, csvDocument, safeFileName } from '../../../shared/csv/csv-writing';
