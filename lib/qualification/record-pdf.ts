import fontkit from '@pdf-lib/fontkit';
import { PDFDocument, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import QRCode from 'qrcode';
import { formatDate } from '../format/format-date';
import { formatVerificationCode } from './verification-code';

/** Paper sizes in PostScript points (1/72 in): ISO 216 A4 is 210 × 297 mm, US Letter 8.5 × 11 in. */
export const PAPER_SIZES = { a4: [595.28, 841.89], letter: [612, 792] } as const;
export type Paper = keyof typeof PAPER_SIZES;

export interface RecordPdfInput {
  traineeName: string;
  courseName: string;
  site: string;
  scope: string;
  issuedOn: string;
  validUntil: string;
  issuedByName: string;
  code: string;
  verifyUrl: string;
}

/** The TrueType fonts to embed (the standard 14 PDF fonts are not embedded, so they are never used). */
export interface RecordFonts {
  regular: Uint8Array;
  bold: Uint8Array;
}

const INK = rgb(0.1, 0.12, 0.16);
const MUTED = rgb(0.35, 0.38, 0.42);

/**
 * The record of training as a one-page PDF (pdf-lib, fonts embedded as subsets): who, which course and
 * scope, issued and valid-until dates, who issued it, and the verification code with a QR code of the
 * public verify page's address, drawn as vector squares.
 */
export async function recordOfTrainingPdf(input: RecordPdfInput, paper: Paper, fonts: RecordFonts): Promise<Uint8Array> {
  const pdf = await PDFDocument.create();
  pdf.registerFontkit(fontkit);
  pdf.setTitle(`Record of training: ${input.traineeName}`);
  pdf.setSubject(input.courseName);
  pdf.setProducer('Evenload');
  pdf.setCreationDate(new Date(`${input.issuedOn}T00:00:00Z`));
  const regular = await pdf.embedFont(fonts.regular, { subset: true });
  const bold = await pdf.embedFont(fonts.bold, { subset: true });
  const [width, height] = PAPER_SIZES[paper];
  const page = pdf.addPage([width, height]);
  const margin = 64;
  const maxWidth = width - 2 * margin;
  let y = height - margin - 20;

  const line = (text: string, font: PDFFont, size: number, color = INK, gap = 8) => {
    for (const part of wrap(text, font, size, maxWidth)) {
      page.drawText(part, { x: margin, y, size, font, color });
      y -= size + gap;
    }
  };
  line('Record of training', bold, 26, INK, 18);
  line('This is to record that', regular, 12, MUTED, 10);
  line(input.traineeName, bold, 22, INK, 16);
  line('completed the course', regular, 12, MUTED, 10);
  line(input.courseName, bold, 16, INK, 6);
  line(input.site, regular, 12, MUTED, 18);

  const fields: Array<[string, string]> = [
    ['Scope', input.scope],
    ['Date issued', formatDate(input.issuedOn)],
    ['Valid until', formatDate(input.validUntil)],
    ['Issued by', input.issuedByName],
  ];
  for (const [label, value] of fields) {
    page.drawText(label, { x: margin, y, size: 11, font: regular, color: MUTED });
    for (const part of wrap(value, bold, 12, maxWidth - 110)) {
      page.drawText(part, { x: margin + 110, y, size: 12, font: bold, color: INK });
      y -= 18;
    }
    y -= 4;
  }

  const qrSize = 132;
  const qrTop = y - 16;
  drawQrCode(page, input.verifyUrl, margin, qrTop - qrSize, qrSize);
  const textX = margin + qrSize + 20;
  page.drawText('Verification code', { x: textX, y: qrTop - 14, size: 11, font: regular, color: MUTED });
  page.drawText(formatVerificationCode(input.code), { x: textX, y: qrTop - 36, size: 16, font: bold, color: INK });
  const check = wrap(`Check this record at ${input.verifyUrl}`, regular, 10, width - margin - textX);
  check.forEach((part, index) => page.drawText(part, { x: textX, y: qrTop - 60 - index * 14, size: 10, font: regular, color: INK }));

  const footer = wrap('Training results on an instrumented training joint. The approved procedure, local codes and qualified engineering judgement govern every real joint.', regular, 9, maxWidth);
  footer.forEach((part, index) => page.drawText(part, { x: margin, y: margin + (footer.length - 1 - index) * 12, size: 9, font: regular, color: MUTED }));
  return pdf.save();
}

/** The QR code (error correction M) as dark squares with a four-module quiet zone inside `size`. */
function drawQrCode(page: PDFPage, text: string, x: number, y: number, size: number): void {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const cell = size / (modules.size + 8);
  for (let row = 0; row < modules.size; row += 1) {
    for (let col = 0; col < modules.size; col += 1) {
      if (!modules.get(row, col)) continue;
      page.drawRectangle({ x: x + (col + 4) * cell, y: y + size - (row + 5) * cell, width: cell, height: cell, color: rgb(0, 0, 0) });
    }
  }
}

/** Greedy word wrap by the font's measured widths; a word longer than the line is left whole. */
function wrap(text: string, font: PDFFont, size: number, maxWidth: number): string[] {
  const lines: string[] = [];
  let current = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const candidate = current ? `${current} ${word}` : word;
    if (current && font.widthOfTextAtSize(candidate, size) > maxWidth) {
      lines.push(current);
      current = word;
    } else {
      current = candidate;
    }
  }
  if (current) lines.push(current);
  return lines;
}
