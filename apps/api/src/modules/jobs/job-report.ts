import { createRequire } from 'node:module';
import type { Readable } from 'node:stream';
import PDFDocument from 'pdfkit';
import { calendarDateIn, cautionKeys, cautionTexts, havDay, jobPhotoTagLabels, litresToImperialGallons, type ReadingFigures } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import type { getJob } from './job-service.ts';

// Full TTF files: pdfkit's font engine cannot read the web build's woff2, and woff subsets drop letters.
const require = createRequire(import.meta.url);
const fontRegular = require.resolve('@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf');
const fontBold = require.resolve('@expo-google-fonts/noto-sans/700Bold/NotoSans_700Bold.ttf');

type JobDetail = Awaited<ReturnType<typeof getJob>>;

/** A job photo for the report: JPEG and PNG are drawn; pdfkit cannot draw WebP, so it is listed. */
export interface ReportPhoto {
  tag: string | null;
  caption: string | null;
  contentType: string;
  image: Buffer | null;
}

export interface ReportContext {
  firmName: string;
  engineerName: string | null;
  timeZone: string;
  photos: ReportPhoto[];
}

const INK = '#1d2525';
const HEAD = '#12403f';
const MUTED = '#56605f';

const one = (n: number | null | undefined) => (n === null || n === undefined ? '-' : n.toFixed(1));

/** The completion report a customer keeps: our own plain layout, A4. */
export function renderJobReport(detail: JobDetail, ctx: ReportContext): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info: { Title: `Heatfleet cleaning report, job ${detail.job.id}`, Author: ctx.firmName } });
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
  const heading = (text: string) => {
    room(60);
    doc.moveDown(0.8).font('bold').fontSize(13).fillColor(HEAD).text(text, left).moveDown(0.2).font('body').fontSize(10).fillColor(INK);
  };
  const line = (label: string, value: string) => doc.font('bold').text(`${label}: `, left, undefined, { continued: true }).font('body').text(value);
  const timeOf = (iso: string) =>
    new Intl.DateTimeFormat('en-GB', { timeZone: ctx.timeZone, day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', hour12: false }).format(new Date(iso));

  /** A plain table: bold header row, thin rules, a new page (with the header again) when it runs out. */
  const table = (columns: { title: string; width: number; align?: 'left' | 'right' }[], rows: string[][]) => {
    const scale = contentWidth / columns.reduce((n, c) => n + c.width, 0);
    const widths = columns.map((c) => c.width * scale);
    const drawRow = (cells: string[], bold: boolean) => {
      doc.font(bold ? 'bold' : 'body').fontSize(8.5);
      const height = Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: widths[i]! - 4 }))) + 4;
      if (doc.y + height > bottom()) {
        doc.addPage();
        if (!bold) drawRow(columns.map((c) => c.title), true);
        doc.font(bold ? 'bold' : 'body').fontSize(8.5);
      }
      const y = doc.y;
      let x = left;
      cells.forEach((c, i) => {
        doc.text(c, x + 2, y + 2, { width: widths[i]! - 4, align: columns[i]!.align ?? 'left' });
        x += widths[i]!;
      });
      doc.moveTo(left, y + height).lineTo(left + contentWidth, y + height).lineWidth(0.4).strokeColor('#b9c2c1').stroke();
      doc.x = left;
      doc.y = y + height;
    };
    drawRow(columns.map((c) => c.title), true);
    for (const r of rows) drawRow(r, false);
    doc.font('body').fontSize(10).fillColor(INK);
    doc.moveDown(0.3);
  };

  const { sheet } = detail;
  doc.font('bold').fontSize(18).fillColor(HEAD).text('System cleaning report');
  doc.font('body').fontSize(10).fillColor(INK).text(ctx.firmName);
  heading('Visit');
  line('Customer', detail.job.site?.customerName ?? '');
  line('Address', `${detail.job.site?.address ?? ''}${detail.job.site?.postcode ? `, ${detail.job.site.postcode}` : ''}`);
  line('Engineer', ctx.engineerName ?? 'Not recorded');
  line('Date', detail.job.completedAt ? calendarDateIn(new Date(detail.job.completedAt), ctx.timeZone) : detail.job.scheduledOn);
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

  heading('Steps of the visit');
  for (const st of sheet.steps) doc.text(`${st.doneAt ? timeOf(st.doneAt) : 'Not ticked'}  ${st.label}${st.doneByName ? ` (${st.doneByName})` : ''}`);
  const c = sheet.circulation;
  if (c.elapsedMinutes !== null) {
    doc.text(`Hot circulation: ${c.elapsedMinutes} minutes${c.minimumMinutes !== null ? ` against the cleaner\u2019s minimum of ${c.minimumMinutes} (${c.met ? 'met' : 'not met'})` : ''}.`);
  }

  heading('Radiators');
  doc.fillColor(MUTED).fontSize(8.5).text(`Surface temperatures in \u00b0C. Cold bottom: top warmer than bottom by more than ${sheet.coldBottomThresholdK} K. Output in watts at the measured mean water temperature (EN 442, n 1.3) where the rated output is known.`);
  doc.fillColor(INK).fontSize(10).moveDown(0.3);
  const cold = (b: ReadingFigures | null, a: ReadingFigures | null) => [b ? (b.coldBottom ? 'yes' : 'no') : '-', a ? (a.coldBottom ? 'yes' : 'no') : '-'].join(' / ');
  const agitations = sheet.radiators.filter((r) => r.agitation);
  table(
    [
      { title: 'Room', width: 16 },
      { title: 'Before top', width: 8, align: 'right' },
      { title: 'Before bottom', width: 9, align: 'right' },
      { title: 'Before diff', width: 8, align: 'right' },
      { title: 'After top', width: 8, align: 'right' },
      { title: 'After bottom', width: 9, align: 'right' },
      { title: 'After diff', width: 8, align: 'right' },
      { title: 'Cold bottom before / after', width: 12 },
      { title: 'Output W before / after', width: 12, align: 'right' },
      { title: 'Agitation min', width: 9, align: 'right' },
    ],
    sheet.radiators.map((r) => [
      r.room,
      one(r.before?.topC),
      one(r.before?.bottomC),
      one(r.before?.differenceK),
      one(r.after?.topC),
      one(r.after?.bottomC),
      one(r.after?.differenceK),
      cold(r.before, r.after),
      `${r.before?.outputWatts ?? '-'} / ${r.after?.outputWatts ?? '-'}`,
      r.agitation ? String(r.agitation.minutes) : '-',
    ]),
  );
  if (agitations.length) {
    const minutes = agitations.reduce((n, r) => n + r.agitation!.minutes, 0);
    // From the raw minutes, as the day's total is, so the two never disagree by rounding.
    const { points } = havDay(agitations.map((r) => ({ magnitudeMs2: r.agitation!.magnitudeMs2, minutes: r.agitation!.minutes })));
    doc.text(`Agitation: ${minutes} minutes in all; ${points} hand-arm vibration points on this visit (HSE points system; 100 is the exposure action value, 400 the limit value).`);
    doc.text(`The engineer\u2019s day (${sheet.hav.day}): ${sheet.hav.message}`);
  }
  const flushed = sheet.radiators.filter((r) => r.flushedAt);
  doc.text(
    flushed.length
      ? `Flushed until clear: ${flushed.map((r) => `${r.room} ${timeOf(r.flushedAt!)}`).join('; ')}${flushed.length < sheet.radiators.length ? ` (${sheet.radiators.length - flushed.length} not recorded)` : ''}.`
      : 'No radiator was recorded as flushed until clear.',
  );

  heading('Water tests');
  const w = sheet.water;
  const result = (ok: boolean) => (ok ? 'PASS' : 'FAIL');
  if (w.mainsTdsPpm !== null || w.systemTdsPpm !== null) {
    line('TDS', `mains ${w.mainsTdsPpm ?? '-'} ppm, system after the final flush ${w.systemTdsPpm ?? '-'} ppm; water ${w.waterClear === true ? 'clear' : w.waterClear === false ? 'not clear' : 'clarity not recorded'}`);
  }
  if (w.figures.flush) {
    line('Flush complete', `${result(w.figures.flush.complete)} (system within ${w.figures.flush.withinPercent}% of mains; needs within 10% and clear water)`);
  } else {
    line('Flush complete', 'Not tested');
  }
  const inh = w.figures.inhibitor;
  if (inh) {
    const unit = inh.unit ? ` ${inh.unit}` : '';
    line('Inhibitor', `${result(inh.result === 'pass')}${inh.result === 'pass' ? '' : ` (${inh.result})`}: reading ${w.inhibitorReading}${unit} against the product\u2019s target ${inh.min} to ${inh.max}${unit}`);
  } else {
    line('Inhibitor', w.inhibitorReading !== null ? `reading ${w.inhibitorReading} (the product has no target range to judge it by)` : 'Not tested');
  }
  line('pH', w.ph !== null ? String(w.ph) : 'Not taken');

  heading('Kit used');
  if (sheet.kitUsed.length === 0) doc.text('None recorded.');
  for (const k of sheet.kitUsed) doc.text(`${k.assetTag}: ${k.kindName}${k.kitName ? ` (${k.kitName})` : ''}`);

  heading('Notes');
  doc.text(sheet.notes || 'None.');

  if (ctx.photos.length) {
    heading('Photos');
    const label = (p: ReportPhoto) => [p.tag ? (jobPhotoTagLabels[p.tag as keyof typeof jobPhotoTagLabels] ?? p.tag) : null, p.caption].filter(Boolean).join(': ') || 'Photo';
    for (const p of ctx.photos) {
      if (p.image) {
        room(200);
        doc.font('bold').text(label(p), left);
        doc.font('body');
        const y = doc.y;
        try {
          doc.image(p.image, left, y, { fit: [240, 170] });
          doc.y = y + 175;
        } catch {
          doc.text('(this photo could not be drawn)', left, y);
        }
      } else {
        doc.text(`${label(p)} (${p.contentType === 'image/webp' ? 'WebP photo, kept with the job: not printable here' : 'photo not available'})`, left);
      }
    }
  }

  heading('Safety');
  for (const key of cautionKeys) doc.text(`\u2022 ${cautionTexts[key]}`, left);
  doc.end();
  return done;
}

async function readAll(stream: Readable): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const part of stream) parts.push(Buffer.isBuffer(part) ? part : Buffer.from(part as Uint8Array));
  return Buffer.concat(parts);
}

/** The report with the firm, the job's engineer and its photos looked up. */
export async function renderReportFor(deps: AppDeps, db: Knex | Knex.Transaction, firmId: number, detail: JobDetail): Promise<Buffer> {
  const firm = (await db('firms').where({ id: firmId }).first('name', 'time_zone')) as { name: string; time_zone: string };
  const engineer = detail.job.engineerMemberId
    ? ((await db('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.firm_id': firmId, 'm.id': detail.job.engineerMemberId }).first('u.name')) as { name: string } | undefined)
    : undefined;
  const rows = (await db('photos').where({ firm_id: firmId, job_id: detail.job.id }).orderBy('id').select('object_key', 'content_type', 'tag', 'caption')) as {
    object_key: string;
    content_type: string;
    tag: string | null;
    caption: string | null;
  }[];
  const photos = await Promise.all(
    rows.map(async (r): Promise<ReportPhoto> => {
      const drawable = r.content_type === 'image/jpeg' || r.content_type === 'image/png';
      let image: Buffer | null = null;
      if (drawable) {
        // A photo storage cannot give back is listed, not fatal: the report still goes out.
        try {
          image = await readAll(await deps.objectStore.get(r.object_key));
        } catch (err) {
          deps.logger.warn({ err, key: r.object_key }, 'job photo left out of the report: object storage did not return it');
        }
      }
      return { tag: r.tag, caption: r.caption, contentType: r.content_type, image };
    }),
  );
  return renderJobReport(detail, { firmName: firm.name, engineerName: engineer?.name ?? null, timeZone: firm.time_zone, photos });
}
