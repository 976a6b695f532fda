import { briefingPdf } from '../services/briefings/pdf/briefing-pdf';
import type { BriefingSnapshot } from '../../shared/schemas/briefings';

/** Renders one briefing PDF in a worker thread; returns the bytes (transferred, not copied). */
export default async function briefingPdfTask(snapshot: BriefingSnapshot): Promise<Uint8Array> {
  const pdf = await briefingPdf(snapshot);
  return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
}
