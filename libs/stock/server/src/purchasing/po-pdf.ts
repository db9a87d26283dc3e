/**
 * The purchase order as a PDF, in our own plain layout: the firm at the top, the supplier and
 * where to deliver, the order's reference and date, one row per line (code, description,
 * quantity in packs, unit cost, line total), the totals and the notes. pdfkit's built-in
 * Helvetica keeps the file small and needs no font files of ours.
 */
import PDFDocument from 'pdfkit';
import { formatMoney } from '@latchwork/stock-domain';
import type { PurchaseOrderView } from './po-view';

/** The firm as the order's letterhead shows it. */
export interface Letterhead {
  name: string;
  addressLines: string[];
  currency: string;
}

/** Minor digits of an ISO 4217 currency, as Intl knows them (2 for GBP, 0 for JPY). */
export function currencyDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
    .maximumFractionDigits as number;
}

const MARGIN = 50;
const COLUMNS = [
  { title: 'Code', width: 80, align: 'left' },
  { title: 'Description', width: 175, align: 'left' },
  { title: 'Quantity', width: 110, align: 'left' },
  { title: 'Unit cost', width: 65, align: 'right' },
  { title: 'Total', width: 65, align: 'right' },
] as const;

/** Renders the order; resolves with the PDF bytes. */
export function purchaseOrderPdf(
  order: PurchaseOrderView,
  firm: Letterhead,
  date: string,
): Promise<Buffer> {
  const digits = currencyDigits(firm.currency);
  const money = (minor: number) => `${formatMoney(minor, digits)} ${firm.currency}`;
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    info: { Title: `Purchase order ${order.reference}`, Author: firm.name },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  doc.font('Helvetica-Bold').fontSize(16).text(firm.name);
  doc
    .font('Helvetica')
    .fontSize(9)
    .text(firm.addressLines.join('\n') || ' ');
  doc.moveDown(1.2);
  doc.font('Helvetica-Bold').fontSize(14).text(`Purchase order ${order.reference}`);
  doc.font('Helvetica').fontSize(10).text(`Date: ${date}`);
  if (order.expectedOn) doc.text(`Wanted by: ${order.expectedOn}`);
  doc.moveDown();

  const top = doc.y;
  const half = (doc.page.width - 2 * MARGIN) / 2;
  const s = order.supplier;
  doc.font('Helvetica-Bold').text('Supplier', MARGIN, top);
  doc.font('Helvetica').text([s.name, ...s.addressLines].join('\n'), { width: half - 10 });
  if (s.accountRef) doc.text(`Our account: ${s.accountRef}`, { width: half - 10 });
  const leftEnd = doc.y;
  const d = order.deliveryLocation;
  doc.font('Helvetica-Bold').text('Deliver to', MARGIN + half, top);
  const place = d
    ? [firm.name, d.name, ...(d.addressLines ?? []), d.postcode ?? ''].filter(Boolean)
    : ['To be agreed'];
  doc.font('Helvetica').text(place.join('\n'), MARGIN + half, doc.y, { width: half });
  doc.y = Math.max(leftEnd, doc.y) + 16;

  const row = (cells: string[], bold = false) => {
    const y = doc.y;
    let x = MARGIN;
    let bottom = y;
    doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(9);
    COLUMNS.forEach((c, i) => {
      doc.text(cells[i] ?? '', x, y, { width: c.width - 6, align: c.align });
      bottom = Math.max(bottom, doc.y);
      x += c.width;
    });
    doc.y = bottom + 4;
    doc.x = MARGIN;
  };
  row(
    COLUMNS.map((c) => c.title),
    true,
  );
  for (const l of order.lines) {
    if (doc.y > doc.page.height - 120) doc.addPage();
    row([
      l.sku,
      l.productName,
      l.quantityPacks,
      formatMoney(l.unitCostMinor, digits),
      formatMoney(l.lineTotalMinor, digits),
    ]);
  }
  doc.moveDown();
  const totals: [string, number][] = [
    ['Net', order.totals.netMinor],
    ['Tax', order.totals.taxMinor],
    ['Total', order.totals.grossMinor],
  ];
  for (const [label, value] of totals)
    doc
      .font(label === 'Total' ? 'Helvetica-Bold' : 'Helvetica')
      .fontSize(10)
      .text(`${label}: ${money(value)}`, MARGIN, doc.y, {
        width: doc.page.width - 2 * MARGIN,
        align: 'right',
      });
  if (order.notes) {
    doc.moveDown();
    doc.font('Helvetica-Bold').text('Notes', MARGIN);
    doc.font('Helvetica').text(order.notes);
  }
  doc.moveDown();
  doc
    .fontSize(8)
    .text(`Please quote ${order.reference} on your delivery note and invoice.`, MARGIN);
  doc.end();
  return done;
}
