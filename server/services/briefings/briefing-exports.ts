import { safeFileName } from '../../../shared/csv/csv-writing';
import { csvFile, type DownloadFile } from '../download-file';
import type { UserRow } from '../auth/auth-service';
import type { TenantScope } from '../tenant-scope';
import { recordEvent } from './briefing-audit';
import { readableBriefing } from './briefing-access';
import type { BriefingService } from './briefing-service';
import { briefingCsv } from './csv-export';
import type { PdfPool } from './pdf/pdf-pool';

const PDF_CACHE_SIZE = 32;

/** PDF and CSV of a published version, logged per download. */
export class BriefingExports {
  // Published versions never change, so their PDFs can be kept; the oldest entry leaves first.
  private readonly pdfCache = new Map<string, Promise<Buffer>>();

  constructor(
    private readonly briefings: BriefingService,
    private readonly pdfs: PdfPool,
  ) {}

  async pdf(scope: TenantScope, user: UserRow, id: number, version: number): Promise<DownloadFile> {
    const b = await readableBriefing(scope, user, id);
    const snapshot = await this.briefings.snapshot(scope, b, version);
    const key = `${scope.organisationId}:${id}:${snapshot.version}`;
    let pdf = this.pdfCache.get(key);
    if (!pdf) {
      pdf = this.pdfs.render(snapshot);
      this.pdfCache.set(key, pdf);
      pdf.catch(() => this.pdfCache.delete(key));
      if (this.pdfCache.size > PDF_CACHE_SIZE) this.pdfCache.delete(this.pdfCache.keys().next().value!);
    }
    const body = await pdf;
    await recordEvent(scope, id, user, 'downloaded-pdf', snapshot.version);
    return { fileName: `${safeFileName(snapshot.title)}-v${snapshot.version}.pdf`, contentType: 'application/pdf', body };
  }

  async csv(scope: TenantScope, user: UserRow, id: number, version: number): Promise<DownloadFile> {
    const b = await readableBriefing(scope, user, id);
    const snapshot = await this.briefings.snapshot(scope, b, version);
    await recordEvent(scope, id, user, 'downloaded-csv', snapshot.version);
    return csvFile(`${safeFileName(snapshot.title)}-v${snapshot.version}.csv`, briefingCsv(snapshot));
  }
}
