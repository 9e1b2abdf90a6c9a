import type { SheetRadiator } from '@heatfleet/domain';
import type { ReportData } from './job-report-data.ts';
import { one, ukCalendarDate, ukDate, ukDateTime, ukTime, yesNo } from './report-format.ts';
import { createReportPdf, HEAD, INK, MUTED, type TableColumn } from './report-pdf.ts';
import { reportResult, visitTimes } from './report-result.ts';
import { drawChemicalsTable, drawReasons, drawSignatures, note, photosSection, type Draw } from './report-sections.ts';

// The report the customer keeps (and is e-mailed), as DEVELOPERS.md, Product rules, "Two documents from one
// job" sets out: it leaves out the engineer's vibration figures, the firm's asset tags and the instructions
// meant for the engineer; the firm's record (firm-record.ts) keeps those.

const drawHeader: Draw = ({ doc, left }, { firm, reportNumber, visitKind }) => {
  doc.font('bold').fontSize(16).fillColor(HEAD).text(firm.name, left);
  doc.font('body').fontSize(9.5).fillColor(INK);
  if (firm.address) doc.text(firm.address.replace(/\s*\n\s*/g, ', '));
  const contact = [firm.phone && `Phone ${firm.phone}`, firm.email && `E-mail ${firm.email}`].filter(Boolean);
  if (contact.length) doc.text(contact.join('   '));
  if (firm.registrationNumbers) doc.text(`Registration: ${firm.registrationNumbers.replace(/\s*\n\s*/g, '; ')}`);
  doc.moveDown(0.8);
  doc
    .font('bold')
    .fontSize(18)
    .fillColor(HEAD)
    .text(visitKind === 'inhibitor_only' ? 'Heating system inhibitor report' : 'Heating system cleaning report');
  doc.font('body').fontSize(10).fillColor(INK).text(`Report number ${reportNumber}`);
};

const drawVisit: Draw = (pdf, data) => {
  const { job } = data.detail;
  const tz = data.firm.timeZone;
  const { startedAt, finishedAt } = visitTimes(data);
  const day = finishedAt ?? startedAt;
  // A time alone when the visit ends on the day it began; the date as well when it ran over midnight.
  const at = (t: string) => (day && ukDate(t, tz) === ukDate(day, tz) ? ukTime(t, tz) : ukDateTime(t, tz));
  pdf.heading('The visit');
  pdf.line('Customer', job.site.customerName);
  pdf.line(
    'Address',
    `${job.site.address.replace(/\s*\n\s*/g, ', ')}${job.site.postcode ? `, ${job.site.postcode}` : ''}`,
  );
  pdf.line('Date', day ? ukDate(day, tz) : ukCalendarDate(job.scheduledOn));
  if (startedAt) pdf.line('Started', at(startedAt));
  if (finishedAt) pdf.line('Finished', at(finishedAt));
  pdf.line('Engineer', data.engineerName ?? 'Not recorded');
};

const drawResult: Draw = (pdf, data) => {
  const r = reportResult(data);
  const next = data.detail.job.nextCheckOn;
  pdf.box('The result', [
    ['System cleaned', r.cleaned],
    ['Flush complete', r.flushComplete],
    ['Inhibitor at target', r.inhibitorAtTarget],
    ['Recommended', r.recommendation],
    ...(next ? [['Next inhibitor check', `by ${ukCalendarDate(next)}`] as [string, string]] : []),
  ]);
};

const boilerKinds: Record<string, string> = { combi: 'Combination', system: 'System', regular: 'Regular (heat only)' };
const fuels: Record<string, string> = { gas: 'gas', oil: 'oil', other: 'other fuel' };

const drawSystem: Draw = (pdf, { detail, system }) => {
  const s = detail.survey;
  const v = detail.volume;
  pdf.heading('Your heating system');
  pdf.line(
    'System',
    s.systemType === 'sealed' ? 'Sealed (pressurised)' : 'Open-vented (fed from a cistern, usually in the loft)',
  );
  pdf.line('Boiler', `${boilerKinds[s.boilerKind] ?? s.boilerKind} boiler, ${fuels[s.fuel] ?? s.fuel}`);
  const makeModel = [system.boilerMake, system.boilerModel].filter(Boolean).join(' ');
  if (makeModel) pdf.line('Make and model', makeModel);
  if (system.boilerLocation) pdf.line('Boiler location', system.boilerLocation);
  pdf.line('Magnetic filter fitted', yesNo(system.magneticFilterFitted));
  if (s.systemType === 'open_vented') pdf.line('Cistern condition', system.cisternCondition ?? 'Not recorded');
  pdf.line('Radiators', String(s.radiators.length));
  pdf.line('Water in the system', `about ${Math.round(v.totalLitres)} litres, ${v.label.toLowerCase()}`);
};

interface RadiatorColumn extends TableColumn {
  value: (r: SheetRadiator, tz: string) => string | null;
}

const temp = (n: number | undefined) => (n === undefined ? null : one(n));
const coldBottom = (b: boolean | undefined) => (b === undefined ? null : b ? 'yes' : 'no');
const radiatorColumns: RadiatorColumn[] = [
  { title: 'Room', width: 18, value: (r) => r.room },
  { title: 'Before: top \u00b0C', width: 9, align: 'right', value: (r) => temp(r.before?.topC) },
  { title: 'Before: bottom \u00b0C', width: 9, align: 'right', value: (r) => temp(r.before?.bottomC) },
  { title: 'Before: cold bottom', width: 9, value: (r) => coldBottom(r.before?.coldBottom) },
  { title: 'Before: output W', width: 9, align: 'right', value: (r) => r.before?.outputWatts?.toString() ?? null },
  { title: 'Cleaned: minutes worked', width: 9, align: 'right', value: (r) => r.agitation?.minutes.toString() ?? null },
  { title: 'Flushed clear at', width: 9, value: (r, tz) => (r.flushedAt ? ukTime(r.flushedAt, tz) : null) },
  { title: 'After: top \u00b0C', width: 9, align: 'right', value: (r) => temp(r.after?.topC) },
  { title: 'After: bottom \u00b0C', width: 9, align: 'right', value: (r) => temp(r.after?.bottomC) },
  { title: 'After: cold bottom', width: 9, value: (r) => coldBottom(r.after?.coldBottom) },
  { title: 'After: output W', width: 9, align: 'right', value: (r) => r.after?.outputWatts?.toString() ?? null },
];

/** The radiator table with only the columns that hold something. */
const drawRadiators: Draw = (pdf, { detail: { sheet }, firm }) => {
  const rows = sheet.radiators;
  const columns = radiatorColumns.filter((c, i) => i === 0 || rows.some((r) => c.value(r, firm.timeZone) !== null));
  if (!rows.length || columns.length === 1) return;
  pdf.heading('Radiators');
  note(
    pdf,
    `Surface temperatures at the top and bottom of each radiator. A "cold bottom" (the top warmer than the bottom by more than ${sheet.coldBottomThresholdK} \u00b0C) usually means sludge.${columns.some((c) => c.title.includes('output')) ? ' Output in watts is worked out from the radiator\u2019s rated output (EN 442).' : ''}`,
  );
  pdf.doc.moveDown(0.3);
  pdf.table(
    columns,
    rows.map((r) => columns.map((c) => c.value(r, firm.timeZone) ?? '-')),
  );
};

const drawWater: Draw = (pdf, { detail: { sheet }, inhibitorTestMethod }) => {
  const w = sheet.water;
  pdf.heading('Water tests');
  if ([w.mainsTdsPpm, w.systemTdsPpm, w.waterClear, w.inhibitorReading, w.ph].every((v) => v === null)) {
    pdf.doc.text('No water test was taken on this visit.');
    return;
  }
  if (w.mainsTdsPpm !== null) pdf.line('Mains water, dissolved solids', `${w.mainsTdsPpm} ppm`);
  if (w.systemTdsPpm !== null) pdf.line('System water, dissolved solids', `${w.systemTdsPpm} ppm`);
  if (w.waterClear !== null) pdf.line('System water clear', yesNo(w.waterClear));
  const inh = w.figures.inhibitor;
  if (w.inhibitorReading !== null)
    pdf.line(
      'Inhibitor reading',
      `${w.inhibitorReading}${inh?.unit ? ` ${inh.unit}` : ''}${inh ? ` (target ${inh.min} to ${inh.max})` : ''}`,
    );
  pdf.line('Inhibitor test method', inhibitorTestMethod ?? 'Not recorded');
  if (w.ph !== null) pdf.line('pH', String(w.ph));
};

const drawPhotos = photosSection(() => 'kept on file: ask us for a copy');

/** For the householder, in plain words; the engineer's own cautions stay on the firm's record. */
const drawSafety: Draw = (pdf, { detail, firm, visitKind }) => {
  const { fuel, systemType } = detail.survey;
  const points = [
    visitKind === 'full_clean'
      ? 'Cleaning can show up radiators, valves or joints that were already weak. Over the next few days, look for drips or damp under radiators and valves; if you find a leak, turn the heating off and call us.'
      : 'If you find drips or damp under a radiator or valve, turn the heating off and call us.',
    systemType === 'sealed'
      ? 'If the pressure gauge on your boiler falls well below its usual reading, or the boiler shows a pressure fault, call us rather than topping it up again and again.'
      : 'Do not add anything to the small cistern in the loft that feeds the heating, and keep its lid on.',
    fuel === 'gas'
      ? // The free gas emergency numbers as commonly published: 0800 111 999 in Great Britain, 0800 002 001 in Northern Ireland.
        'Only a Gas Safe registered engineer may work on a gas boiler. If you smell gas, open doors and windows, do not use electrical switches, and call the gas emergency number from outside: 0800 111 999 (England, Scotland and Wales) or 0800 002 001 (Northern Ireland).'
      : 'Have your boiler worked on only by a competent engineer registered for its fuel.',
    'The inhibitor in your system protects it from corrosion. Do not add other products to the system without asking us, and have the inhibitor checked every year.',
  ];
  pdf.heading('Keeping safe');
  for (const p of points) pdf.doc.text(`\u2022 ${p}`, pdf.left).moveDown(0.2);
  pdf.doc.moveDown(0.4);
  pdf.doc
    .fillColor(MUTED)
    .fontSize(8.5)
    .text(`Questions about this report: ${[firm.name, firm.phone, firm.email].filter(Boolean).join(', ')}.`);
};

/** The customer's report: our own plain layout, A4, the result first, "Page X of Y" on every page. */
export function renderCustomerReport(data: ReportData): Promise<Buffer> {
  const pdf = createReportPdf({ title: `Heating system report ${data.reportNumber}`, author: data.firm.name });
  for (const draw of [
    drawHeader,
    drawVisit,
    drawResult,
    drawSystem,
    drawRadiators,
    drawChemicalsTable,
    drawWater,
    drawReasons,
    drawPhotos,
    drawSignatures,
    drawSafety,
  ])
    draw(pdf, data);
  return pdf.finish(
    (page, pages) => `${data.firm.name} \u00b7 Report ${data.reportNumber} \u00b7 Page ${page} of ${pages}`,
  );
}
