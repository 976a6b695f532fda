import { Piscina } from 'piscina';
import type { BriefingSnapshot } from '../../../../shared/schemas/briefings';

const WORKER = new URL('../../../workers/briefing-pdf-worker.ts', import.meta.url);
const TSX_LOADER = /tsx/;

/**
 * One worker thread that lays out briefing PDFs (ECharts server-side rendering and pdfkit take up
 * to a second or two), so the API's event loop keeps answering other requests meanwhile. The thread
 * starts on the first PDF and stops when idle. As in the simulation pool, a process not started by
 * tsx (e.g. Vitest) gives the thread tsx's loader.
 */
export class PdfPool {
  private piscina: Piscina | null = null;

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({ filename: WORKER.href, minThreads: 0, maxThreads: 1, idleTimeout: 30_000, execArgv });
    return this.piscina;
  }

  async render(snapshot: BriefingSnapshot): Promise<Buffer> {
    const bytes = (await this.pool.run(snapshot)) as Uint8Array;
    return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }

  async close(): Promise<void> {
    await this.piscina?.close({ force: true });
    this.piscina = null;
  }
}
