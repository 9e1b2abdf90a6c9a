import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { litresToImperialGallons } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { getJob } from './job-service.ts';

// Full TTF files: pdfkit's font engine cannot read the web build's woff2, and woff subsets drop letters.
const require = createRequire(import.meta.url);
const fontRegular = require.resolve('@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf');
const fontBold = require.resolve('@expo-google-fonts/noto-sans/700Bold/NotoSans_700Bold.ttf');

export const reportCautions = [
  'Hot water and surfaces scald: the system was allowed to cool before draining.',
  'The boiler was isolated electrically and proved dead before work on it.',
  'Work on gas appliances is only for a business on the Gas Safe Register; oil appliances only for a competent, registered person.',
  'Products were used as their safety data sheets direct; cleaners are never mixed.',
  'Flushing water and sludge go to a foul drain, never a surface-water drain.',
  'Sealed systems relieve at about 3 bar; old open-vented pipework is not over-pressurised.',
  'The figures in this report supported the engineer\u2019s judgement; they do not replace it. Local codes, the manufacturers\u2019 instructions and licensed practice come first.',
];

type JobDetail = Awaited<ReturnType<typeof getJob>>;

/** The completion report a customer keeps: our own plain layout, A4. */
export function renderJobReport(detail: JobDetail, firmName: string, engineerName: string | null): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info: { Title: `Heatfleet cleaning report, job ${detail.job.id}`, Author: firmName } });
  doc.registerFont('body', fontRegular);
  doc.registerFont('bold', fontBold);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  const heading = (text: string) => doc.moveDown(0.8).font('bold').fontSize(13).fillColor('#12403f').text(text).moveDown(0.2).font('body').fontSize(10).fillColor('#1d2525');
  const line = (label: string, value: string) => doc.font('bold').text(`${label}: `, { continued: true }).font('body').text(value);

  doc.font('bold').fontSize(18).fillColor('#12403f').text('System cleaning report');
  doc.font('body').fontSize(10).fillColor('#1d2525').text(firmName);
  heading('Visit');
  line('Customer', detail.job.site?.customerName ?? '');
  line('Address', `${detail.job.site?.address ?? ''}${detail.job.site?.postcode ? `, ${detail.job.site.postcode}` : ''}`);
  line('Engineer', engineerName ?? 'Not recorded');
  line('Date', detail.job.completedAt ? detail.job.completedAt.slice(0, 10) : detail.job.scheduledOn);
  line('Next inhibitor check due', detail.job.nextCheckOn ?? 'Not set');

  heading('System');
  const s = detail.survey;
  line('System', `${s.systemType === 'sealed' ? 'Sealed' : 'Open-vented'}, ${s.boilerKind} boiler, ${s.fuel}`);
  line('Radiators', String(s.radiators.length));
  const v = detail.volume;
  line('System water volume', `${v.totalLitres.toFixed(1)} litres (${litresToImperialGallons(v.totalLitres).toFixed(1)} imperial gallons)${v.estimate ? ', estimated' : ''}`);
  doc.text(v.howReached);
  doc.text(`Radiators ${v.radiatorsLitres.toFixed(1)} L, pipework ${v.pipeworkLitres.toFixed(1)} L, heat exchanger ${v.heatExchangerLitres.toFixed(1)} L, cylinder coil ${v.cylinderCoilLitres.toFixed(1)} L, other ${v.otherLitres.toFixed(1)} L.`);

  heading('Chemicals used');
  if (detail.chemicalsUsed.length === 0) doc.text('None recorded.');
  for (const c of detail.chemicalsUsed) doc.text(`${c.product}: ${c.packs} pack(s), lot ${c.lotNumber}, use by ${c.expiresOn}`);
  for (const d of detail.doses) {
    doc.text(`${d.product.name}: plan ${d.packs} pack(s) (${d.decidedBy === 'radiators' ? 'by the radiators rule' : 'by system volume'}${d.litres !== null ? `, ${d.litres.toFixed(2)} L by label rate` : ''}).`);
  }

  heading('Radiators surveyed');
  for (const r of s.radiators) {
    doc.text(`${r.room}: ${r.panel.replace(/_/g, ' ')}${r.heightMm && r.lengthMm ? `, ${r.heightMm} x ${r.lengthMm} mm` : ''}${r.coldSpotNote ? `; ${r.coldSpotNote}` : ''}`);
  }

  heading('Safety');
  for (const c of reportCautions) doc.text(`\u2022 ${c}`);
  doc.end();
  return done;
}

/** The report with the firm's name and the job's engineer looked up. */
export async function renderReportFor(db: Knex | Knex.Transaction, firmId: number, detail: JobDetail): Promise<Buffer> {
  const firm = (await db('firms').where({ id: firmId }).first('name')) as { name: string };
  const engineer = detail.job.engineerMemberId
    ? ((await db('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.firm_id': firmId, 'm.id': detail.job.engineerMemberId }).first('u.name')) as { name: string } | undefined)
    : undefined;
  return renderJobReport(detail, firm.name, engineer?.name ?? null);
}
