import { briefingPdf } from '../services/briefings/pdf/briefing-pdf';
import type { BriefingSnapshot } from '../../shared/schemas/briefings';
import type { PooledTask } from '../services/thread-pool';

/** Renders one briefing PDF in a worker thread and returns its bytes. */
export default async function briefingPdfTask({ task: snapshot, progress }: PooledTask<BriefingSnapshot>): Promise<Uint8Array> {
  try {
    const pdf = await briefingPdf(snapshot);
    return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  } finally {
    progress.close();
  }
}
