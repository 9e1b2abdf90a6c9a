import type { ReportData } from './job-report-data.ts';
import { ukCalendarDate } from './report-format.ts';

/** The result box at the top of the customer's report: four answers a householder looks for first. */
export interface ReportResult {
  cleaned: string;
  flushComplete: string;
  inhibitorAtTarget: string;
  recommendation: string;
}

const stepDone = (data: ReportData, step: string) => data.detail.sheet.steps.some((s) => s.step === step && s.doneAt);

/**
 * Cleaned: a full clean whose cleaner went in (dosed, or taken off the van) and whose radiators were flushed
 * (each ticked, or the flush step ticked for the whole system).
 */
export function systemCleaned(data: ReportData): boolean {
  if (data.visitKind !== 'full_clean') return false;
  const { radiators } = data.detail.sheet;
  const cleanerIn = stepDone(data, 'dose_cleaner') || data.chemicals.some((c) => c.kind === 'cleaner');
  const flushed = stepDone(data, 'flush') || (radiators.length > 0 && radiators.every((r) => r.flushedAt));
  return cleanerIn && flushed;
}

export function reportResult(data: ReportData): ReportResult {
  const { water } = data.detail.sheet;
  const flush = water.figures.flush;
  const inh = water.figures.inhibitor;
  const unit = inh?.unit ? ` ${inh.unit}` : '';
  const cleaned = systemCleaned(data);
  return {
    cleaned:
      data.visitKind === 'inhibitor_only'
        ? 'Not part of this visit (an inhibitor visit: dose and test only)'
        : cleaned
          ? 'Yes'
          : 'No: see "Not done, and why" below',
    flushComplete: flush
      ? flush.complete
        ? `Yes: the system water was clear and within ${flush.withinPercent}% of the mains water's dissolved solids`
        : `No: the system water was ${water.waterClear ? '' : 'not clear, or '}${flush.withinPercent}% away from the mains water's dissolved solids (the aim is within 10% and clear)`
      : data.visitKind === 'inhibitor_only'
        ? 'Not part of this visit'
        : 'Not tested',
    inhibitorAtTarget: inh
      ? `${inh.result === 'pass' ? 'Yes' : `No, ${inh.result}`}: reading ${water.inhibitorReading}${unit}, the product's target ${inh.min} to ${inh.max}${unit}`
      : water.inhibitorReading !== null
        ? `Reading ${water.inhibitorReading} (the product gives no target to judge it by)`
        : 'Not tested',
    recommendation: recommendation(data, { flushFailed: flush?.complete === false, inhibitor: inh?.result ?? null }),
  };
}

/** The engineer's own words when written; otherwise what the results call for, in plain words. */
function recommendation(data: ReportData, r: { flushFailed: boolean; inhibitor: 'pass' | 'low' | 'high' | null }) {
  if (data.recommendation) return data.recommendation;
  const lines: string[] = [];
  if (r.flushFailed) lines.push('A further flush, as the water was not yet as clean as the mains.');
  if (r.inhibitor === 'low') lines.push("Top up the inhibitor to the maker's target and test again.");
  if (r.inhibitor === 'high') lines.push('No action for the inhibitor now; test again at the next check.');
  if (r.inhibitor === null && data.detail.sheet.water.inhibitorReading === null)
    lines.push('Have the inhibitor level tested: it was not tested on this visit.');
  const next = data.detail.job.nextCheckOn;
  if (next) lines.push(`Have the inhibitor checked by ${ukCalendarDate(next)}.`);
  return lines.join(' ') || 'No further work needed.';
}

/** Start and finish of the visit: the first thing recorded for it, and the completion (instants). */
export function visitTimes(data: ReportData): { startedAt: string | null; finishedAt: string | null } {
  const { sheet, job } = data.detail;
  const instants = [
    ...data.signatures.filter((s) => s.kind === 'acknowledgement').map((s) => s.signedAt),
    ...sheet.steps.map((s) => s.doneAt),
    ...sheet.radiators.map((r) => r.flushedAt),
    sheet.circulation.startedAt,
  ].filter((t): t is string => t !== null);
  const startedAt = instants.sort((a, b) => Date.parse(a) - Date.parse(b))[0] ?? null;
  return { startedAt, finishedAt: job.completedAt };
}
