import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { createJobInputSchema, type HeatExchangerDefaults } from '@heatfleet/domain';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { clearDraft } from '@/lib/offline/drafts';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useCreateJob } from '@/features/jobs/api/use-job-mutations';
import { CustomerSitePicker } from '@/features/jobs/components/customer-search';
import {
  JobForm,
  jobFormInput,
  systemDetailsDraft,
  type EngineerChoice,
  type JobFormValues,
} from '@/features/jobs/components/job-form';
import type { DoseProduct, VanStock } from '@/features/jobs/components/live-plan-panel';
import { defaultProductIds } from '@/features/jobs/components/product-choices';
import { initialSurveyDraft } from '@/features/jobs/components/survey-draft';

export type { EngineerChoice };

/** The booking's draft on the phone (booking needs signal: it is kept, not queued). */
const NEW_JOB_DRAFT = 'job:new:booking';

/** Books a job: the customer found by a few letters, the survey by count, the plan worked out as it is typed. */
export function NewJobForm({
  products,
  engineers,
  defaultEngineerId,
  today,
  heatExchangerDefaults,
  ownDefaults,
  vanStock,
}: {
  products: DoseProduct[];
  engineers: EngineerChoice[];
  defaultEngineerId: number | null;
  today: string;
  heatExchangerDefaults: HeatExchangerDefaults | null;
  ownDefaults: boolean;
  vanStock: VanStock | null;
}) {
  const navigate = useNavigate();
  const create = useCreateJob();
  const [siteId, setSiteId] = useState<number | null>(null);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [initial] = useState<JobFormValues>(() => ({
    scheduledOn: today,
    scheduledTime: '',
    engineerId: defaultEngineerId ? String(defaultEngineerId) : '',
    visitKind: 'full_clean',
    survey: initialSurveyDraft(),
    systemDetails: systemDetailsDraft(null),
    productIds: defaultProductIds(products, 'full_clean'),
  }));

  const submit = (values: JobFormValues) => {
    const parsed = createJobInputSchema.safeParse({ siteId: siteId ?? undefined, ...jobFormInput(values) });
    if (!parsed.success) {
      const byField = firstErrorPerField(parsed.error.issues);
      if (byField.siteId) byField.siteId = 'Choose or add the site.';
      setErrors(byField);
      setFormError('Some fields need attention: see the messages beside them.');
      return;
    }
    setErrors({});
    setFormError(null);
    create.mutate(parsed.data, {
      onSuccess: (detail) => {
        void clearDraft(NEW_JOB_DRAFT);
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
      customerPicker={<CustomerSitePicker siteId={siteId} onSiteChange={setSiteId} siteError={errors.siteId} />}
      submitLabel="Book the job"
      draftKey={NEW_JOB_DRAFT}
      busy={create.isPending}
      formError={formError}
      errors={errors}
      onSubmit={submit}
    />
  );
}
