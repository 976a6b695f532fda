import { Piscina } from 'piscina';
import type { BriefingSnapshot } from '../../../../shared/schemas/briefings';

const WORKER = new URL('../../../workers/briefing-pdf-worker.ts', import.meta.url);
const TSX_LOADER = /tsx/;

/**
 * One worker thread that lays out briefing PDFs (ECharts server-side rendering and pdfkit take up
 * to a second or two), so the API's event loop keeps answering other requests meanwhile. The thread
 * starts on the first PDF (or at server start, see warm) and otherwise stops when idle. As in the simulation pool, a process not started by
 * tsx (e.g. Vitest) gives the thread tsx's loader.
 */
export class PdfPool {
  private piscina: Piscina | null = null;
  private keepWarm = false;

  /** Starts the thread now and keeps it (the server does this), so no reader waits for pdfkit and ECharts to load. */
  warm(): void {
    this.keepWarm = true;
    void this.pool;
  }

  private get pool(): Piscina {
    const execArgv = process.execArgv.some((a) => TSX_LOADER.test(a)) ? process.execArgv : [...process.execArgv, '--import', 'tsx'];
    this.piscina ??= new Piscina({ filename: WORKER.href, minThreads: this.keepWarm ? 1 : 0, maxThreads: 1, idleTimeout: 30_000, execArgv });
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
