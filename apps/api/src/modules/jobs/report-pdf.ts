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
  heading(text: string): void;
  line(label: string, value: string): void;
  /** A plain table: bold header row, thin rules, a new page (with the header again) when it runs out. */
  table(columns: TableColumn[], rows: string[][]): void;
  /** Ends the document; resolves with its bytes. */
  finish(): Promise<Buffer>;
}

export function createReportPdf(info: { title: string; author: string }): ReportPdf {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info: { Title: info.title, Author: info.author } });
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

  return {
    doc,
    left,
    room,
    heading: (text) => {
      room(60);
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
    finish: () => {
      doc.end();
      return done;
    },
  };
}
