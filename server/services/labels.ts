// QR labels as a printable PDF. The QR payload is the item's URL on this server, so any phone
// camera opens the item page. Codes are drawn as vector squares (sharp at any printer
// resolution) with the tag, name and rated voltage in text beside them.
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import path from 'node:path';
import { labelUrl } from './items';

export interface LabelItem {
  tag: string;
  name: string;
  ratedKv: number | null;
}

const MM = 72 / 25.4;
// A common 21-up sheet: 3 x 7 labels of 63.5 x 38.1 mm on A4.
const SHEET = {
  pageWidth: 210 * MM,
  pageHeight: 297 * MM,
  columns: 3,
  rows: 7,
  labelWidth: 63.5 * MM,
  labelHeight: 38.1 * MM,
  left: 7.2 * MM,
  top: 15.15 * MM,
  gap: 2.5 * MM,
};
const FONT_DIR = path.dirname(require.resolve('@expo-google-fonts/atkinson-hyperlegible/package.json'));
const FONT_REGULAR = path.join(FONT_DIR, '400Regular', 'AtkinsonHyperlegible_400Regular.ttf');
const FONT_BOLD = path.join(FONT_DIR, '700Bold', 'AtkinsonHyperlegible_700Bold.ttf');

function drawQr(doc: PDFKit.PDFDocument, text: string, x: number, y: number, size: number): void {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const count = qr.modules.size;
  const quiet = 2; // the label's own white margin completes the quiet zone
  const cell = size / (count + quiet * 2);
  doc.save().fillColor('black');
  for (let row = 0; row < count; row += 1) {
    for (let col = 0; col < count; col += 1) {
      if (qr.modules.get(row, col)) doc.rect(x + (col + quiet) * cell, y + (row + quiet) * cell, cell + 0.01, cell + 0.01);
    }
  }
  doc.fill().restore();
}

function drawLabel(doc: PDFKit.PDFDocument, item: LabelItem, publicUrl: string, x: number, y: number): void {
  const { labelWidth: w, labelHeight: h } = SHEET;
  const qrSize = h - 2 * MM;
  drawQr(doc, labelUrl(publicUrl, item.tag), x + 1 * MM, y + 1 * MM, qrSize);
  const textX = x + qrSize + 2 * MM;
  const textWidth = w - qrSize - 4 * MM;
  doc
    .font('bold')
    .fontSize(11)
    .fillColor('black')
    .text(item.tag, textX, y + 4 * MM, { width: textWidth, lineBreak: false });
  doc
    .font('regular')
    .fontSize(7.5)
    .text(item.name, textX, y + 9.5 * MM, { width: textWidth, height: 14 * MM, ellipsis: true });
  const rating = item.ratedKv === null ? 'No kV rating' : `Max ${item.ratedKv} kV`;
  doc
    .font('bold')
    .fontSize(9)
    .text(rating, textX, y + h - 12 * MM, { width: textWidth, lineBreak: false });
  doc
    .font('regular')
    .fontSize(6)
    .fillColor('#333333')
    .text('Scan before use · Voltcrib', textX, y + h - 6.5 * MM, { width: textWidth, lineBreak: false });
}

async function render(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.end();
  return done;
}

function newDocument(size: [number, number]): PDFKit.PDFDocument {
  const doc = new PDFDocument({ size, margin: 0, autoFirstPage: false, info: { Title: 'Voltcrib labels', Creator: 'Voltcrib' } });
  doc.registerFont('regular', FONT_REGULAR);
  doc.registerFont('bold', FONT_BOLD);
  return doc;
}

/** A sheet (or several) of 21 labels per A4 page. */
export async function labelSheetPdf(items: LabelItem[], publicUrl: string): Promise<Buffer> {
  const doc = newDocument([SHEET.pageWidth, SHEET.pageHeight]);
  const perPage = SHEET.columns * SHEET.rows;
  items.forEach((item, index) => {
    if (index % perPage === 0) doc.addPage();
    const slot = index % perPage;
    const col = slot % SHEET.columns;
    const row = Math.floor(slot / SHEET.columns);
    drawLabel(doc, item, publicUrl, SHEET.left + col * (SHEET.labelWidth + SHEET.gap), SHEET.top + row * SHEET.labelHeight);
  });
  return render(doc);
}

/** One label on a page of its own size, for a label printer. */
export async function singleLabelPdf(item: LabelItem, publicUrl: string): Promise<Buffer> {
  const doc = newDocument([SHEET.labelWidth, SHEET.labelHeight]);
  doc.addPage();
  drawLabel(doc, item, publicUrl, 0, 0);
  return render(doc);
}

/** The label's code alone as SVG, for the item page. */
export async function labelSvg(tag: string, publicUrl: string): Promise<string> {
  return QRCode.toString(labelUrl(publicUrl, tag), { type: 'svg', errorCorrectionLevel: 'M', margin: 2 });
}
