import { jobPhotoTagLabels } from '@heatfleet/domain';
import type { ReportData, ReportPhoto, ReportSignature } from './job-report-data.ts';
import { packSize, ukCalendarDate, ukDateTime } from './report-format.ts';
import { MUTED, INK, type ReportPdf } from './report-pdf.ts';

// Sections both documents print the same way: photos, signatures, reasons, chemicals.

export type Draw = (pdf: ReportPdf, data: ReportData) => void;

export function photoLabel(p: ReportPhoto): string {
  const tag = p.tag ? ((jobPhotoTagLabels as Record<string, string>)[p.tag] ?? p.tag) : null;
  return [tag, p.caption].filter(Boolean).join(': ') || 'Photo';
}

/** Draws an image between its heading and caption, the three kept on one page; a note if pdfkit cannot read it. */
function figure(pdf: ReportPdf, heading: string, image: Buffer, fit: [number, number], caption?: string): void {
  const { doc, left, room } = pdf;
  room(fit[1] + (caption ? 45 : 30));
  doc.font('bold').fontSize(10).fillColor(INK).text(heading, left);
  doc.font('body');
  const y = doc.y + 2;
  try {
    doc.image(image, left, y, { fit });
    doc.y = y + fit[1] + 6;
  } catch {
    doc.text('(this picture could not be drawn)', left, y);
  }
  doc.x = left;
  if (caption) doc.text(caption, left);
}

/** The job's photos under their headings; one that cannot be drawn is named with `unprintable`'s words. */
export const photosSection =
  (unprintable: (p: ReportPhoto) => string): Draw =>
  (pdf, { photos }) => {
    if (!photos.length) return;
    pdf.heading('Photos', photos[0]!.image ? 200 : 20);
    for (const p of photos) {
      if (p.image) figure(pdf, photoLabel(p), p.image, [240, 170]);
      else pdf.doc.text(`${photoLabel(p)} (${unprintable(p)})`, pdf.left);
    }
  };

const signatureTitles: Record<ReportSignature['kind'], string> = {
  acknowledgement: 'Before the work: the customer understood that cleaning can reveal weak radiators, valves or joints',
  acceptance: 'After the work: the customer accepted the work',
};

export const drawSignatures: Draw = (pdf, { signatures, firm }) => {
  pdf.heading('Signatures', signatures[0]?.image ? 105 : 30);
  if (!signatures.length) {
    pdf.doc.text('No signature was taken on this visit.');
    return;
  }
  for (const s of signatures) {
    const caption = `${s.name}, signed ${ukDateTime(s.signedAt, firm.timeZone)}`;
    if (s.image) figure(pdf, signatureTitles[s.kind], s.image, [200, 60], caption);
    else pdf.doc.font('bold').text(signatureTitles[s.kind], pdf.left).font('body').text(caption, pdf.left);
    pdf.doc.moveDown(0.5);
  }
};

/** The reasons given at completion for anything not done, with what was found (none: the section is left out). */
export const drawReasons: Draw = (pdf, { reasons }) => {
  if (!reasons.length) return;
  pdf.heading('Not done, and why');
  for (const r of reasons) {
    pdf.doc.font('bold').text(r.label, pdf.left);
    pdf.doc.font('body').text(`Found: ${r.found}`, pdf.left);
    pdf.doc.text(`Reason given: ${r.reason}`, pdf.left).moveDown(0.3);
  }
};

export const drawChemicalsTable: Draw = (pdf, { chemicals }) => {
  pdf.heading('Chemicals used');
  if (!chemicals.length) {
    pdf.doc.text('None recorded.');
    return;
  }
  pdf.table(
    [
      { title: 'Product', width: 30 },
      { title: 'Pack size', width: 12 },
      { title: 'Packs', width: 8, align: 'right' },
      { title: 'Lot', width: 18 },
      { title: 'Use by', width: 18 },
    ],
    chemicals.map((c) => [
      c.product,
      packSize(c.packSizeMl),
      String(c.packs),
      c.lotNumber,
      ukCalendarDate(c.expiresOn),
    ]),
  );
};

export const note = (pdf: ReportPdf, text: string) => {
  pdf.doc.fillColor(MUTED).fontSize(8.5).text(text, pdf.left).fillColor(INK).fontSize(10);
};
