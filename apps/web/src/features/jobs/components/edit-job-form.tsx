import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { updateJobInputSchema, type HeatExchangerDefaults, type JobDetail } from '@heatfleet/domain';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { clearDraft } from '@/lib/offline/drafts';
import { useUpdateJob } from '@/features/jobs/api/use-job-sheet-mutations';
import {
  JobForm,
  jobFormInput,
  systemDetailsDraft,
  type EngineerChoice,
  type JobFormValues,
} from '@/features/jobs/components/job-form';
import type { DoseProduct, VanStock } from '@/features/jobs/components/live-plan-panel';
import { surveyToDraft } from '@/features/jobs/components/survey-draft';

/** Edits or reschedules a booked job: the same form as booking, the site fixed. */
export function EditJobForm({
  detail,
  products,
  engineers,
  heatExchangerDefaults,
  ownDefaults,
  vanStock,
}: {
  detail: JobDetail;
  products: DoseProduct[];
  engineers: EngineerChoice[];
  heatExchangerDefaults: HeatExchangerDefaults | null;
  ownDefaults: boolean;
  vanStock: VanStock | null;
}) {
  const navigate = useNavigate();
  const update = useUpdateJob(detail.job.id);
  const [errors, setErrors] = useState<FieldErrors>({});
  const draftKey = `job:${detail.job.id}:edit`;
  const [formError, setFormError] = useState<string | null>(null);
  const [initial] = useState<JobFormValues>(() => ({
    scheduledOn: detail.job.scheduledOn,
    scheduledTime: detail.job.scheduledTime ?? '',
    engineerId: detail.job.engineerMemberId ? String(detail.job.engineerMemberId) : '',
    visitKind: detail.job.visitKind,
    survey: surveyToDraft(detail.survey),
    systemDetails: systemDetailsDraft(detail.job.systemDetails),
    productIds: detail.doses.map((d) => d.product.id),
  }));

  const submit = (values: JobFormValues) => {
    const parsed = updateJobInputSchema.safeParse(jobFormInput(values));
    if (!parsed.success) {
      setErrors(firstErrorPerField(parsed.error.issues));
      setFormError('Some fields need attention: see the messages beside them.');
      return;
    }
    setErrors({});
    setFormError(null);
    // Written from the survey this form opened with: if someone changed it since, the server says so (409).
    const input = parsed.data.survey ? { ...parsed.data, surveyVersion: detail.job.surveyVersion } : parsed.data;
    update.mutate(input, {
      onSuccess: () => {
        void clearDraft(draftKey);
        void navigate(paths.job.getHref(detail.job.id));
      },
      onError: (error) => {
        if (isApiError(error) && error.details.length) setErrors(firstErrorPerField(error.details));
        setFormError(error.message);
      },
    });
  };

  return (
    <JobForm
      initial={initial}
      products={products}
      engineers={engineers}
      heatExchangerDefaults={heatExchangerDefaults}
      ownDefaults={ownDefaults}
      vanStock={vanStock}
      customerPicker={
        <p className="rounded-lg bg-brand-50 px-3 py-2 font-semibold text-brand-900">
          {detail.job.site.customerName}, {detail.job.site.address}
        </p>
      }
      submitLabel="Save the changes"
      draftKey={draftKey}
      busy={update.isPending}
      formError={formError}
      errors={errors}
      onSubmit={submit}
    />
  );
}
