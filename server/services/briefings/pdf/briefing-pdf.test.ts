import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../../../shared/text/cautions';
import { formatRanged, scaleRanged } from '../../../../shared/briefings/format';
import { testSnapshot } from '../../../../tests/fixtures/briefing-snapshot';
import { briefingPdf } from './briefing-pdf';

async function pdfText(pdf: Buffer): Promise<{ text: string; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const result = await parser.getText();
    return { text: result.text.replace(/\s+/g, ' '), pages: result.total };
  } finally {
    await parser.destroy();
  }
}

describe('briefingPdf', () => {
  const s = testSnapshot();

  it('is a valid PDF with a title page, the headline numbers, page numbers and the cautions', async () => {
    const pdf = await briefingPdf(s);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.subarray(-6).toString()).toContain('%%EOF');
    const { text, pages } = await pdfText(pdf);
    expect(pages).toBeGreaterThan(3);
    expect(text).toContain('Added melt in the Hollin valley');
    expect(text).toContain('Hollin valley');
    expect(text).toContain('Corrie & Vell Hydrology');
    expect(text).toContain('30 November 2026');
    for (const h of s.headlines) {
      expect(text).toContain(h.variantName);
      expect(text).toContain(`${formatRanged(scaleRanged(h.addedVolumeM3, 1e-6), 2)} million m³`);
      expect(text).toContain(`${formatRanged(h.addedRunoffPercentOfBaseline, 1)} %`);
    }
    for (const caution of CAUTIONS) expect(text).toContain(caution);
    expect(text).toContain(`Page 2 of ${pages}`);
    expect(text.lastIndexOf('Cautions')).toBeGreaterThan(text.lastIndexOf('Assumptions'));
  });

  it('embeds its own fonts and draws charts as vectors, not images', async () => {
    const raw = (await briefingPdf(s)).toString('latin1');
    expect(raw).toMatch(/\/FontFile2/);
    expect(raw).not.toMatch(/\/Subtype\s*\/Image/);
    // Axis names of the server-rendered charts arrive as text.
    const { text } = await pdfText(await briefingPdf(s));
    expect(text).toContain('Added melt (million m³)');
  });

  it('sets narrative as plain text: raw HTML in Markdown never reaches the page', async () => {
    const { text } = await pdfText(await briefingPdf(s));
    expect(text).toContain('black carbon from valley traffic');
    expect(text).not.toContain('alert(');
    expect(text).not.toContain('<script');
  });
});
