import type { JobSheet } from '@heatfleet/domain';
import { AgitationForm } from '@/features/jobs/components/agitation-form';
import { FlushedTick } from '@/features/jobs/components/flushed-tick';
import { JudgementNote } from '@/features/jobs/components/job-cautions';
import { ReadingForm, watts } from '@/features/jobs/components/reading-form';
import { panelLabels, type PanelType } from '@/features/jobs/components/survey-draft';

function panelLabel(panel: string): string {
  return panel in panelLabels ? panelLabels[panel as PanelType] : panel;
}

export function RadiatorLog({ jobId, sheet, timeZone }: { jobId: number; sheet: JobSheet; timeZone: string }) {
  if (sheet.radiators.length === 0) return <p className="text-ink-muted">The survey lists no radiators.</p>;
  return (
    <div className="space-y-4">
      <p className="text-ink-muted">
        A cold bottom is flagged when the top is more than {sheet.coldBottomThresholdK} K warmer than the bottom (the
        firm&apos;s setting).
      </p>
      <JudgementNote />
      {sheet.radiators.map((radiator) => {
        const name = `Radiator ${radiator.index + 1}: ${radiator.room}`;
        return (
          <div
            key={radiator.index}
            role="group"
            aria-label={name}
            className="space-y-3 rounded-xl border-2 border-line-strong p-3"
          >
            <div>
              <h3 className="text-lg font-bold text-brand-900">{name}</h3>
              <p className="text-sm text-ink-muted">
                {panelLabel(radiator.panel)} ·{' '}
                {radiator.ratedWatts ? `rated ${watts.format(radiator.ratedWatts)} W at dT 50` : 'no rated output'}
              </p>
            </div>
            <div className="grid gap-3 lg:grid-cols-3">
              <ReadingForm jobId={jobId} radiator={radiator} phase="before" sheet={sheet} />
              <AgitationForm jobId={jobId} radiator={radiator} sheet={sheet} />
              <ReadingForm jobId={jobId} radiator={radiator} phase="after" sheet={sheet} />
            </div>
            <FlushedTick jobId={jobId} radiator={radiator} sheet={sheet} timeZone={timeZone} />
          </div>
        );
      })}
    </div>
  );
}

export function radiatorsSummary(sheet: JobSheet): string {
  const read = sheet.radiators.filter((r) => r.before && r.after).length;
  const cold = sheet.radiators.filter((r) => (r.after ?? r.before)?.coldBottom).length;
  return `${read} of ${sheet.radiators.length} read before and after${cold ? ` · ${cold} with a cold bottom` : ''}`;
}
