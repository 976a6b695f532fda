import type { BriefingSnapshot } from '../../../../shared/schemas/briefings';
import { ThreadPool } from '../../thread-pool';
import type { ThreadBudget } from '../../thread-budget';

/**
 * The worker thread that lays out briefing PDFs (ECharts server-side rendering and pdfkit take up
 * to a second or two), so the API's event loop keeps answering meanwhile. A reader is waiting, so
 * its tasks go before background work in the shared thread budget.
 */
export class PdfPool extends ThreadPool<BriefingSnapshot, Uint8Array> {
  constructor(budget: ThreadBudget) {
    super(new URL('../../../workers/briefing-pdf-worker.ts', import.meta.url), budget, 'interactive');
  }

  async render(snapshot: BriefingSnapshot): Promise<Buffer> {
    const bytes = await this.run(snapshot);
    return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }
}
