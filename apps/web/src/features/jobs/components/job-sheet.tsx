import type { JobDetail } from '@heatfleet/domain';
import { HavDayPanel, havSummary } from '@/features/jobs/components/hav-day-panel';
import { StepCautions } from '@/features/jobs/components/job-cautions';
import { JobNotesForm } from '@/features/jobs/components/job-notes-form';
import { JobPhotos } from '@/features/jobs/components/job-photos';
import { JobSteps, stepGroups, stepsSummary } from '@/features/jobs/components/job-steps';
import { KitUsedForm } from '@/features/jobs/components/kit-used-form';
import { RadiatorLog, radiatorsSummary } from '@/features/jobs/components/radiator-log';
import { SheetSection } from '@/features/jobs/components/sheet-section';
import { WaterTestsForm, waterSummary, type InhibitorChoice } from '@/features/jobs/components/water-tests-form';

/**
 * The on-site record, phone first, in the order of the work: the steps before the radiators, the
 * radiators one by one, the steps after, the water tests; then what is looked at less often, folded.
 * Every field saves on its own. Read-only once the job is completed (the API says so).
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
  const groups = stepGroups(sheet);
  const radiatorWork = groups.radiators.length > 0 && sheet.radiators.length > 0;
  const radiatorCautions = sheet.steps
    .filter((s) => groups.radiators.includes(s.step))
    .flatMap((s) => s.cautions)
    .filter((c, i, all) => all.findIndex((o) => o.key === c.key) === i);
  return (
    <div className="space-y-5">
      <SheetSection
        title={radiatorWork ? 'Before the radiators' : 'Steps'}
        summary={stepsSummary(sheet, groups.before)}
      >
        <JobSteps jobId={jobId} sheet={sheet} timeZone={timeZone} steps={groups.before} />
      </SheetSection>
      {radiatorWork ? (
        <SheetSection title="Radiators" summary={radiatorsSummary(sheet)}>
          <StepCautions cautions={radiatorCautions} label="Cautions before flushing" />
          <RadiatorLog
            jobId={jobId}
            sheet={sheet}
            timeZone={timeZone}
            footer={
              <JobSteps jobId={jobId} sheet={sheet} timeZone={timeZone} steps={groups.radiators} withCautions={false} />
            }
          />
        </SheetSection>
      ) : null}
      {groups.after.length ? (
        <SheetSection title="After the radiators" summary={stepsSummary(sheet, groups.after)}>
          <JobSteps jobId={jobId} sheet={sheet} timeZone={timeZone} steps={groups.after} />
        </SheetSection>
      ) : null}
      <SheetSection title="Water tests" summary={waterSummary(sheet)}>
        <WaterTestsForm jobId={jobId} sheet={sheet} inhibitors={inhibitors} defaultInhibitorId={dosedInhibitor} />
      </SheetSection>
      <SheetSection title="Vibration today" summary={havSummary(sheet.hav)} defaultOpen={sheet.hav.level !== 'low'}>
        <HavDayPanel hav={sheet.hav} />
      </SheetSection>
      <SheetSection
        title="Kit used"
        summary={`${sheet.kitUsed.length} item${sheet.kitUsed.length === 1 ? '' : 's'}`}
        defaultOpen={false}
      >
        <KitUsedForm jobId={jobId} sheet={sheet} />
      </SheetSection>
      <SheetSection
        title="Photos"
        summary={`${sheet.photos.length} photo${sheet.photos.length === 1 ? '' : 's'}`}
        defaultOpen={false}
      >
        <JobPhotos jobId={jobId} sheet={sheet} timeZone={timeZone} />
      </SheetSection>
      <SheetSection title="Notes" summary={sheet.notes ? 'Written' : 'None yet'} defaultOpen={false}>
        <JobNotesForm jobId={jobId} sheet={sheet} />
      </SheetSection>
    </div>
  );
}
