import {
  calendarDateIn,
  havDay,
  litresToImperialGallons,
  visitKindLabels,
  type ReadingFigures,
} from '@heatfleet/domain';
import type { ReportData } from './job-report-data.ts';
import { one, packSize, ukDateTime, ukTime, yesNo } from './report-format.ts';
import { createReportPdf, HEAD, INK, MUTED } from './report-pdf.ts';
import { drawReasons, drawSignatures, photosSection, type Draw } from './report-sections.ts';

// The firm's internal record of a job: everything the sheet holds, who did what and when, the engineer's
// vibration points and the kit's asset tags (DEVELOPERS.md, Product rules, "Two documents from one job").
// The customer gets customer-report.ts instead.

const drawVisit: Draw = ({ doc, heading, line }, { detail, firm, engineerName, reportNumber, visitKind }) => {
  doc.font('bold').fontSize(18).fillColor(HEAD).text('System cleaning report');
  doc.font('body').fontSize(10).fillColor(INK).text(firm.name);
  doc.fillColor(MUTED).text(`The firm's record, report ${reportNumber}: for the firm, not the customer.`);
  doc.fillColor(INK);
  heading('Visit');
  const { job } = detail;
  line('Visit', visitKindLabels[visitKind]);
  line('Customer', job.site.customerName);
  line('Address', `${job.site.address}${job.site.postcode ? `, ${job.site.postcode}` : ''}`);
  line('Engineer', engineerName ?? 'Not recorded');
  line('Date', job.completedAt ? calendarDateIn(new Date(job.completedAt), firm.timeZone) : job.scheduledOn);
  if (job.completedAt) line('Completed', ukDateTime(job.completedAt, firm.timeZone));
  line('Next inhibitor check due', job.nextCheckOn ?? 'Not set');
};

const drawSystem: Draw = ({ doc, heading, line }, { detail, system }) => {
  heading('System');
  const s = detail.survey;
  line('System', `${s.systemType === 'sealed' ? 'Sealed' : 'Open-vented'}, ${s.boilerKind} boiler, ${s.fuel}`);
  const boiler = [system.boilerMake, system.boilerModel].filter(Boolean).join(' ');
  if (boiler || system.boilerLocation)
    line('Boiler', [boiler, system.boilerLocation && `in the ${system.boilerLocation}`].filter(Boolean).join(', '));
  line('Magnetic filter fitted', yesNo(system.magneticFilterFitted));
  if (s.systemType === 'open_vented') line('Cistern', system.cisternCondition ?? 'Not recorded');
  line('Radiators', String(s.radiators.length));
  const v = detail.volume;
  line(
    'System water volume',
    `${v.totalLitres.toFixed(1)} litres (${litresToImperialGallons(v.totalLitres).toFixed(1)} imperial gallons), ${v.label.toLowerCase()}`,
  );
  doc.text(v.howReached);
  doc.text(
    `Radiators ${v.radiatorsLitres.toFixed(1)} L, pipework ${v.pipeworkLitres.toFixed(1)} L, heat exchanger ${v.heatExchangerLitres.toFixed(1)} L, cylinder coil ${v.cylinderCoilLitres.toFixed(1)} L, other ${v.otherLitres.toFixed(1)} L.`,
  );
};

const drawChemicals: Draw = ({ doc, heading }, { detail, chemicals }) => {
  heading('Chemicals used');
  if (chemicals.length === 0) doc.text('None recorded.');
  for (const c of chemicals)
    doc.text(
      `${c.product}: ${c.packs} pack(s) of ${packSize(c.packSizeMl)}, lot ${c.lotNumber}, use by ${c.expiresOn}`,
    );
  for (const d of detail.doses) {
    doc.text(
      `${d.product.name}: plan ${d.packs} pack(s) of ${packSize(d.product.packSizeMl)} (${d.decidedBy === 'radiators' ? 'by the radiators rule' : 'by system volume'}${d.litres !== null ? `, ${d.litres.toFixed(2)} L by label rate` : ''}).`,
    );
  }
};

const drawSteps: Draw = ({ doc, heading }, { detail: { sheet }, firm }) => {
  heading('Steps of the visit');
  for (const st of sheet.steps)
    doc.text(
      `${st.doneAt ? timeOf(st.doneAt, firm.timeZone) : 'Not ticked'}  ${st.label}${st.doneByName ? ` (${st.doneByName})` : ''}`,
    );
  const c = sheet.circulation;
  if (c.elapsedMinutes !== null) {
    doc.text(
      `Hot circulation: ${c.elapsedMinutes} minutes${c.minimumMinutes !== null ? ` against the cleaner\u2019s minimum of ${c.minimumMinutes} (${c.met ? 'met' : 'not met'})` : ''}.`,
    );
  }
};

/** "3 Dec, 14:05": the record's steps and flushes, short. */
const timeOf = (iso: string, timeZone: string) =>
  `${new Intl.DateTimeFormat('en-GB', { timeZone, day: 'numeric', month: 'short' }).format(new Date(iso))}, ${ukTime(iso, timeZone)}`;

const drawRadiators: Draw = ({ doc, heading, table }, { detail: { sheet }, firm }) => {
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
  const agitations = sheet.radiators.flatMap((r) => (r.agitation ? [{ room: r.room, ...r.agitation }] : []));
  if (agitations.length) {
    const minutes = agitations.reduce((n, a) => n + a.minutes, 0);
    // From the raw minutes, as the day's total is, so the two never disagree by rounding.
    const { points } = havDay(agitations.map((a) => ({ magnitudeMs2: a.magnitudeMs2, minutes: a.minutes })));
    doc.text(
      `Agitation: ${minutes} minutes in all; ${points} hand-arm vibration points on this visit (HSE points system; 100 is the exposure action value, 400 the limit value).`,
    );
    const byTool = new Map<string, number>();
    for (const a of agitations) if (a.kitItemTag) byTool.set(a.kitItemTag, (byTool.get(a.kitItemTag) ?? 0) + 1);
    if (byTool.size)
      doc.text(
        `Vibrating tools: ${[...byTool].map(([tag, n]) => `${tag} on ${n} radiator${n === 1 ? '' : 's'}`).join('; ')}.`,
      );
    doc.text(`The engineer\u2019s day (${sheet.hav.day}): ${sheet.hav.message}`);
  }
  const flushed = sheet.radiators.filter((r) => r.flushedAt);
  doc.text(
    flushed.length
      ? `Flushed until clear: ${flushed.map((r) => `${r.room} ${timeOf(r.flushedAt!, firm.timeZone)}`).join('; ')}${flushed.length < sheet.radiators.length ? ` (${sheet.radiators.length - flushed.length} not recorded)` : ''}.`
      : 'No radiator was recorded as flushed until clear.',
  );
};

const drawWaterTests: Draw = ({ heading, line }, { detail: { sheet }, inhibitorTestMethod }) => {
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
  if (inhibitorTestMethod) line('Inhibitor test method', inhibitorTestMethod);
  line('pH', w.ph !== null ? String(w.ph) : 'Not taken');
};

const drawKitAndNotes: Draw = ({ doc, heading }, { detail: { sheet }, recommendation }) => {
  heading('Kit used');
  if (sheet.kitUsed.length === 0) doc.text('None recorded.');
  for (const k of sheet.kitUsed) doc.text(`${k.assetTag}: ${k.kindName}${k.kitName ? ` (${k.kitName})` : ''}`);
  heading('Notes');
  doc.text(sheet.notes || 'None.');
  if (recommendation) doc.text(`Recommended to the customer: ${recommendation}`);
};

const drawPhotos = photosSection((p) =>
  p.contentType === 'image/webp' ? 'WebP photo, kept with the job: not printable here' : 'photo not available',
);

/** The cautions that fit this system, fuel and visit, as the sheet showed them. */
const drawSafety: Draw = ({ doc, left, heading }, { detail: { sheet } }) => {
  heading('Safety');
  for (const c of sheet.cautions) doc.text(`\u2022 ${c.text}`, left);
};

/** The firm's record of a job: our own plain layout, A4, one section after another. */
export function renderFirmRecord(data: ReportData): Promise<Buffer> {
  const pdf = createReportPdf({
    title: `Heatfleet cleaning record, report ${data.reportNumber}`,
    author: data.firm.name,
  });
  for (const draw of [
    drawVisit,
    drawSystem,
    drawChemicals,
    drawSteps,
    drawRadiators,
    drawWaterTests,
    drawReasons,
    drawKitAndNotes,
    drawSignatures,
    drawPhotos,
    drawSafety,
  ])
    draw(pdf, data);
  return pdf.finish(
    (page, pages) => `${data.firm.name} \u00b7 the firm's record ${data.reportNumber} \u00b7 Page ${page} of ${pages}`,
  );
}
