import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';

// Full TTF files: pdfkit's font engine cannot read the web build's woff2, and woff subsets drop letters.
const require = createRequire(import.meta.url);
const fontRegular = require.resolve('@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf');
const fontBold = require.resolve('@expo-google-fonts/noto-sans/700Bold/NotoSans_700Bold.ttf');

export const INK = '#1d2525';
export const HEAD = '#12403f';
export const MUTED = '#56605f';

export interface TableColumn {
  title: string;
  width: number;
  align?: 'left' | 'right';
}

/** An A4 document in our plain layout, with the few drawing steps a report needs. */
export interface ReportPdf {
  doc: InstanceType<typeof PDFDocument>;
  left: number;
  /** Starts a new page when fewer than `height` points are left on this one. */
  room(height: number): void;
  /** A section heading, moved to a new page unless `keepWith` points fit under it. */
  heading(text: string, keepWith?: number): void;
  line(label: string, value: string): void;
  /** A plain table: bold header row, thin rules, a new page (with the header again) when it runs out. */
  table(columns: TableColumn[], rows: string[][]): void;
  /** A framed panel of label and value lines under a title, kept on one page. */
  box(title: string, rows: [label: string, value: string][]): void;
  /** Ends the document, with `footer(page, pages)` printed at the foot of every page; resolves with its bytes. */
  finish(footer?: (page: number, pages: number) => string): Promise<Buffer>;
}

export function createReportPdf(info: { title: string; author: string }): ReportPdf {
  // Pages are kept until the end so each can carry "Page X of Y" once the count is known.
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    bufferPages: true,
    info: { Title: info.title, Author: info.author },
  });
  doc.registerFont('body', fontRegular);
  doc.registerFont('bold', fontBold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  const left = doc.page.margins.left;
  const contentWidth = doc.page.width - left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const room = (height: number) => {
    if (doc.y + height > bottom()) doc.addPage();
  };

  const table = (columns: TableColumn[], rows: string[][]) => {
    const scale = contentWidth / columns.reduce((n, c) => n + c.width, 0);
    const widths = columns.map((c) => c.width * scale);
    const drawRow = (cells: string[], bold: boolean) => {
      doc.font(bold ? 'bold' : 'body').fontSize(8.5);
      const height = Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: widths[i]! - 4 }))) + 4;
      if (doc.y + height > bottom()) {
        doc.addPage();
        if (!bold)
          drawRow(
            columns.map((c) => c.title),
            true,
          );
        doc.font(bold ? 'bold' : 'body').fontSize(8.5);
      }
      const y = doc.y;
      let x = left;
      cells.forEach((c, i) => {
        doc.text(c, x + 2, y + 2, { width: widths[i]! - 4, align: columns[i]!.align ?? 'left' });
        x += widths[i]!;
      });
      doc
        .moveTo(left, y + height)
        .lineTo(left + contentWidth, y + height)
        .lineWidth(0.4)
        .strokeColor('#b9c2c1')
        .stroke();
      doc.x = left;
      doc.y = y + height;
    };
    drawRow(
      columns.map((c) => c.title),
      true,
    );
    for (const r of rows) drawRow(r, false);
    doc.font('body').fontSize(10).fillColor(INK);
    doc.moveDown(0.3);
  };

  const box = (title: string, rows: [string, string][]) => {
    const pad = 8;
    const labelWidth = 150;
    const valueWidth = contentWidth - labelWidth - 2 * pad;
    doc.font('bold').fontSize(10);
    const heights = rows.map(([label, value]) =>
      Math.max(
        doc.font('bold').heightOfString(label, { width: labelWidth - 6 }),
        doc.font('body').heightOfString(value, { width: valueWidth }),
      ),
    );
    const titleHeight = doc
      .font('bold')
      .fontSize(12)
      .heightOfString(title, { width: contentWidth - 2 * pad });
    const height = pad * 2 + titleHeight + 4 + heights.reduce((n, h) => n + h + 3, 0);
    doc.moveDown(0.6);
    room(height + 10);
    const top = doc.y;
    doc.roundedRect(left, top, contentWidth, height, 4).lineWidth(1.2).strokeColor(HEAD).stroke();
    doc
      .font('bold')
      .fontSize(12)
      .fillColor(HEAD)
      .text(title, left + pad, top + pad, { width: contentWidth - 2 * pad });
    let y = top + pad + titleHeight + 4;
    doc.fontSize(10).fillColor(INK);
    rows.forEach(([label, value], i) => {
      doc.font('bold').text(label, left + pad, y, { width: labelWidth - 6 });
      doc.font('body').text(value, left + pad + labelWidth, y, { width: valueWidth });
      y += heights[i]! + 3;
    });
    doc.x = left;
    doc.y = top + height + 4;
  };

  const footers = (footer: (page: number, pages: number) => string) => {
    const { start, count } = doc.bufferedPageRange();
    for (let i = start; i < start + count; i++) {
      doc.switchToPage(i);
      // Writing below the bottom margin would start a new page: lift the margin while the footer is drawn.
      const bottomMargin = doc.page.margins.bottom;
      doc.page.margins.bottom = 0;
      doc
        .font('body')
        .fontSize(8.5)
        .fillColor(MUTED)
        .text(footer(i - start + 1, count), left, doc.page.height - bottomMargin + 18, {
          width: contentWidth,
          align: 'center',
          lineBreak: false,
        });
      doc.page.margins.bottom = bottomMargin;
    }
  };

  return {
    doc,
    left,
    room,
    heading: (text, keepWith = 40) => {
      room(keepWith + 30);
      doc
        .moveDown(0.8)
        .font('bold')
        .fontSize(13)
        .fillColor(HEAD)
        .text(text, left)
        .moveDown(0.2)
        .font('body')
        .fontSize(10)
        .fillColor(INK);
    },
    line: (label, value) => {
      doc.font('bold').text(`${label}: `, left, undefined, { continued: true }).font('body').text(value);
    },
    table,
    box,
    finish: (footer) => {
      if (footer) footers(footer);
      doc.end();
      return done;
    },
  };
}
