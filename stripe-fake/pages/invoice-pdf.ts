import PDFDocument from 'pdfkit';
import { formatMoney } from '../services/invoicing';
import type { Invoice } from '../types';
import { WORDING } from './wording';

const day = (unix: number) => new Date(unix * 1000).toISOString().slice(0, 10);

/** A one-page PDF of the invoice, made with pdfkit's built-in Helvetica (no font files). */
export function renderInvoicePdf(invoice: Invoice): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 56, info: { Title: WORDING.invoiceTitle(invoice.number) } });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  const money = (amount: number) => formatMoney(amount, invoice.currency);

  doc.font('Helvetica-Bold').fontSize(18).text(WORDING.invoiceTitle(invoice.number));
  doc.font('Helvetica').fontSize(10).fillColor('#555555');
  doc.text(`${WORDING.testMode}`);
  doc.text(`Issued ${day(invoice.created)} to ${invoice.customer_name ?? invoice.customer_email ?? invoice.customer}`);
  doc.text(`Status: ${invoice.status === 'paid' ? WORDING.invoicePaid : WORDING.invoiceOpen}`);
  doc.moveDown().fillColor('#000000').fontSize(11);
  for (const line of invoice.lines.data) {
    doc.text(`${line.description} (${day(line.period.start)} – ${day(line.period.end)})`, { continued: true });
    doc.text(`  ${money(line.amount)}`, { align: 'right' });
  }
  doc.moveDown().font('Helvetica-Bold');
  doc.text(`${WORDING.total}: ${money(invoice.total)}`, { align: 'right' });
  doc.text(`${WORDING.amountDue}: ${money(invoice.amount_due)}`, { align: 'right' });
  doc.text(`${WORDING.amountPaid}: ${money(invoice.amount_paid)}`, { align: 'right' });
  doc.end();
  return done;
}
