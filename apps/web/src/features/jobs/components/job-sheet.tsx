import type { JobDetail } from '@heatfleet/domain';
import { HavDayPanel, havSummary } from '@/features/jobs/components/hav-day-panel';
import { JobNotesForm } from '@/features/jobs/components/job-notes-form';
import { JobPhotos } from '@/features/jobs/components/job-photos';
import { JobSteps, stepsSummary } from '@/features/jobs/components/job-steps';
import { KitUsedForm } from '@/features/jobs/components/kit-used-form';
import { RadiatorLog, radiatorsSummary } from '@/features/jobs/components/radiator-log';
import { SheetSection } from '@/features/jobs/components/sheet-section';
import { WaterTestsForm, waterSummary, type InhibitorChoice } from '@/features/jobs/components/water-tests-form';

/**
 * The on-site record, phone first: each section saves on its own, so a lost signal costs one
 * section's typing, not the visit. Read-only once the job is completed (the API says so).
 */
export function JobSheetSections({
  detail,
  timeZone,
  inhibitors,
}: {
  detail: JobDetail;
  timeZone: string;
  inhibitors: InhibitorChoice[];
}) {
  const { sheet } = detail;
  const jobId = detail.job.id;
  const dosedInhibitor = detail.doses.find((d) => d.product.kind === 'inhibitor')?.product.id ?? null;
  return (
    // Wet or gloved fingers: every box and list on the sheet is at least 48 px tall, above the app's 44 px.
    <div className="space-y-5 [&_input:not([type])]:min-h-12 [&_select]:min-h-12">
      <SheetSection title="Steps" summary={stepsSummary(sheet)}>
        <JobSteps jobId={jobId} sheet={sheet} timeZone={timeZone} />
      </SheetSection>
      <SheetSection title="Radiators" summary={radiatorsSummary(sheet)}>
        <RadiatorLog jobId={jobId} sheet={sheet} timeZone={timeZone} />
      </SheetSection>
      <SheetSection title="Vibration today" summary={havSummary(sheet.hav)}>
        <HavDayPanel hav={sheet.hav} />
      </SheetSection>
      <SheetSection title="Water tests" summary={waterSummary(sheet)}>
        <WaterTestsForm jobId={jobId} sheet={sheet} inhibitors={inhibitors} defaultInhibitorId={dosedInhibitor} />
      </SheetSection>
      <SheetSection title="Kit used" summary={`${sheet.kitUsed.length} item${sheet.kitUsed.length === 1 ? '' : 's'}`}>
        <KitUsedForm jobId={jobId} sheet={sheet} />
      </SheetSection>
      <SheetSection title="Photos" summary={`${sheet.photos.length} photo${sheet.photos.length === 1 ? '' : 's'}`}>
        <JobPhotos jobId={jobId} sheet={sheet} timeZone={timeZone} />
      </SheetSection>
      <SheetSection title="Notes" summary={sheet.notes ? 'Written' : 'None yet'}>
        <JobNotesForm jobId={jobId} sheet={sheet} />
      </SheetSection>
    </div>
  );
}
