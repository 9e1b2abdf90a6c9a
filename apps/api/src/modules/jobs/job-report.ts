import {
  calendarDateIn,
  cautionKeys,
  cautionTexts,
  havDay,
  jobPhotoTagLabels,
  litresToImperialGallons,
  type JobDetail,
  type ReadingFigures,
} from '@heatfleet/domain';
import { createReportPdf, HEAD, INK, MUTED, type ReportPdf } from './report-pdf.ts';

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

type Draw = (pdf: ReportPdf, detail: JobDetail, ctx: ReportContext) => void;

const one = (n: number | null | undefined) => (n === null || n === undefined ? '-' : n.toFixed(1));

const timeOf = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-GB', {
    timeZone,
    day: 'numeric',
    month: 'short',
    hour: '2-digit',
    minute: '2-digit',
    hour12: false,
  }).format(new Date(iso));

const drawVisit: Draw = ({ doc, heading, line }, detail, ctx) => {
  doc.font('bold').fontSize(18).fillColor(HEAD).text('System cleaning report');
  doc.font('body').fontSize(10).fillColor(INK).text(ctx.firmName);
  heading('Visit');
  const { job } = detail;
  line('Customer', job.site.customerName);
  line('Address', `${job.site.address}${job.site.postcode ? `, ${job.site.postcode}` : ''}`);
  line('Engineer', ctx.engineerName ?? 'Not recorded');
  line('Date', job.completedAt ? calendarDateIn(new Date(job.completedAt), ctx.timeZone) : job.scheduledOn);
  line('Next inhibitor check due', job.nextCheckOn ?? 'Not set');
};

const drawSystem: Draw = ({ doc, heading, line }, detail) => {
  heading('System');
  const s = detail.survey;
  line('System', `${s.systemType === 'sealed' ? 'Sealed' : 'Open-vented'}, ${s.boilerKind} boiler, ${s.fuel}`);
  line('Radiators', String(s.radiators.length));
  const v = detail.volume;
  line(
    'System water volume',
    `${v.totalLitres.toFixed(1)} litres (${litresToImperialGallons(v.totalLitres).toFixed(1)} imperial gallons)${v.estimate ? ', estimated' : ''}`,
  );
  doc.text(v.howReached);
  doc.text(
    `Radiators ${v.radiatorsLitres.toFixed(1)} L, pipework ${v.pipeworkLitres.toFixed(1)} L, heat exchanger ${v.heatExchangerLitres.toFixed(1)} L, cylinder coil ${v.cylinderCoilLitres.toFixed(1)} L, other ${v.otherLitres.toFixed(1)} L.`,
  );
};

const drawChemicals: Draw = ({ doc, heading }, detail) => {
  heading('Chemicals used');
  if (detail.chemicalsUsed.length === 0) doc.text('None recorded.');
  for (const c of detail.chemicalsUsed)
    doc.text(`${c.product}: ${c.packs} pack(s), lot ${c.lotNumber}, use by ${c.expiresOn}`);
  for (const d of detail.doses) {
    doc.text(
      `${d.product.name}: plan ${d.packs} pack(s) (${d.decidedBy === 'radiators' ? 'by the radiators rule' : 'by system volume'}${d.litres !== null ? `, ${d.litres.toFixed(2)} L by label rate` : ''}).`,
    );
  }
};

const drawSteps: Draw = ({ doc, heading }, { sheet }, ctx) => {
  heading('Steps of the visit');
  for (const st of sheet.steps)
    doc.text(
      `${st.doneAt ? timeOf(st.doneAt, ctx.timeZone) : 'Not ticked'}  ${st.label}${st.doneByName ? ` (${st.doneByName})` : ''}`,
    );
  const c = sheet.circulation;
  if (c.elapsedMinutes !== null) {
    doc.text(
      `Hot circulation: ${c.elapsedMinutes} minutes${c.minimumMinutes !== null ? ` against the cleaner\u2019s minimum of ${c.minimumMinutes} (${c.met ? 'met' : 'not met'})` : ''}.`,
    );
  }
};

const drawRadiators: Draw = ({ doc, heading, table }, { sheet }, ctx) => {
  heading('Radiators');
  doc
    .fillColor(MUTED)
    .fontSize(8.5)
    .text(
      `Surface temperatures in \u00b0C. Cold bottom: top warmer than bottom by more than ${sheet.coldBottomThresholdK} K. Output in watts at the measured mean water temperature (EN 442, n 1.3) where the rated output is known.`,
    );
  doc.fillColor(INK).fontSize(10).moveDown(0.3);
  const cold = (b: ReadingFigures | null, a: ReadingFigures | null) =>
    [b ? (b.coldBottom ? 'yes' : 'no') : '-', a ? (a.coldBottom ? 'yes' : 'no') : '-'].join(' / ');
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
  const agitations = sheet.radiators.flatMap((r) => (r.agitation ? [r.agitation] : []));
  if (agitations.length) {
    const minutes = agitations.reduce((n, a) => n + a.minutes, 0);
    // From the raw minutes, as the day's total is, so the two never disagree by rounding.
    const { points } = havDay(agitations.map((a) => ({ magnitudeMs2: a.magnitudeMs2, minutes: a.minutes })));
    doc.text(
      `Agitation: ${minutes} minutes in all; ${points} hand-arm vibration points on this visit (HSE points system; 100 is the exposure action value, 400 the limit value).`,
    );
    doc.text(`The engineer\u2019s day (${sheet.hav.day}): ${sheet.hav.message}`);
  }
  const flushed = sheet.radiators.filter((r) => r.flushedAt);
  doc.text(
    flushed.length
      ? `Flushed until clear: ${flushed.map((r) => `${r.room} ${timeOf(r.flushedAt!, ctx.timeZone)}`).join('; ')}${flushed.length < sheet.radiators.length ? ` (${sheet.radiators.length - flushed.length} not recorded)` : ''}.`
      : 'No radiator was recorded as flushed until clear.',
  );
};

const drawWaterTests: Draw = ({ heading, line }, { sheet }) => {
  heading('Water tests');
  const w = sheet.water;
  const result = (ok: boolean) => (ok ? 'PASS' : 'FAIL');
  if (w.mainsTdsPpm !== null || w.systemTdsPpm !== null) {
    line(
      'TDS',
      `mains ${w.mainsTdsPpm ?? '-'} ppm, system after the final flush ${w.systemTdsPpm ?? '-'} ppm; water ${w.waterClear === true ? 'clear' : w.waterClear === false ? 'not clear' : 'clarity not recorded'}`,
    );
  }
  if (w.figures.flush) {
    line(
      'Flush complete',
      `${result(w.figures.flush.complete)} (system within ${w.figures.flush.withinPercent}% of mains; needs within 10% and clear water)`,
    );
  } else {
    line('Flush complete', 'Not tested');
  }
  const inh = w.figures.inhibitor;
  if (inh) {
    const unit = inh.unit ? ` ${inh.unit}` : '';
    line(
      'Inhibitor',
      `${result(inh.result === 'pass')}${inh.result === 'pass' ? '' : ` (${inh.result})`}: reading ${w.inhibitorReading}${unit} against the product\u2019s target ${inh.min} to ${inh.max}${unit}`,
    );
  } else {
    line(
      'Inhibitor',
      w.inhibitorReading !== null
        ? `reading ${w.inhibitorReading} (the product has no target range to judge it by)`
        : 'Not tested',
    );
  }
  line('pH', w.ph !== null ? String(w.ph) : 'Not taken');
};

const drawKitAndNotes: Draw = ({ doc, heading }, { sheet }) => {
  heading('Kit used');
  if (sheet.kitUsed.length === 0) doc.text('None recorded.');
  for (const k of sheet.kitUsed) doc.text(`${k.assetTag}: ${k.kindName}${k.kitName ? ` (${k.kitName})` : ''}`);
  heading('Notes');
  doc.text(sheet.notes || 'None.');
};

const drawPhotos: Draw = ({ doc, left, room, heading }, _detail, ctx) => {
  if (!ctx.photos.length) return;
  heading('Photos');
  const label = (p: ReportPhoto) =>
    [p.tag ? (jobPhotoTagLabels[p.tag as keyof typeof jobPhotoTagLabels] ?? p.tag) : null, p.caption]
      .filter(Boolean)
      .join(': ') || 'Photo';
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
      doc.text(
        `${label(p)} (${p.contentType === 'image/webp' ? 'WebP photo, kept with the job: not printable here' : 'photo not available'})`,
        left,
      );
    }
  }
};

const drawSafety: Draw = ({ doc, left, heading }) => {
  heading('Safety');
  for (const key of cautionKeys) doc.text(`\u2022 ${cautionTexts[key]}`, left);
};

/** The completion report a customer keeps: our own plain layout, A4, one section after another. */
export function renderJobReport(detail: JobDetail, ctx: ReportContext): Promise<Buffer> {
  const pdf = createReportPdf({ title: `Heatfleet cleaning report, job ${detail.job.id}`, author: ctx.firmName });
  for (const draw of [
    drawVisit,
    drawSystem,
    drawChemicals,
    drawSteps,
    drawRadiators,
    drawWaterTests,
    drawKitAndNotes,
    drawPhotos,
    drawSafety,
  ])
    draw(pdf, detail, ctx);
  return pdf.finish();
}
