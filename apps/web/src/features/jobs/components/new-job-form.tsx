import { useId, useMemo, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { boilerKinds, createJobInputSchema, defaultHeatExchangerLitres } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useCreateJob } from '@/features/jobs/api/use-job-mutations';
import { CustomerSitePicker } from '@/features/jobs/components/customer-site-picker';
import { LivePlanPanel, type DoseProduct } from '@/features/jobs/components/live-plan-panel';
import { PipeRunRows } from '@/features/jobs/components/pipe-run-rows';
import { RadiatorRows } from '@/features/jobs/components/radiator-rows';
import {
  draftToLiveSurvey,
  draftToSurveyInput,
  initialSurveyDraft,
  type SurveyDraft,
} from '@/features/jobs/components/survey-draft';

export interface EngineerChoice {
  memberId: number;
  name: string;
}

const boilerLabels: Record<(typeof boilerKinds)[number], string> = {
  combi: 'Combi',
  system: 'System',
  regular: 'Regular (heat only)',
};

function ProductChoices({
  products,
  chosen,
  onChange,
}: {
  products: DoseProduct[];
  chosen: number[];
  onChange: (ids: number[]) => void;
}) {
  const id = useId();
  return (
    <fieldset className="space-y-2">
      <legend className="text-lg font-bold text-brand-900">Products to dose</legend>
      {products.length === 0 ? (
        <p className="text-ink-muted">The firm has no cleaner or inhibitor set up yet.</p>
      ) : null}
      {products.map((p) => (
        <div key={p.id} className="flex min-h-11 items-center gap-3">
          <input
            id={`${id}-${p.id}`}
            type="checkbox"
            className="size-6 accent-brand-700"
            checked={chosen.includes(p.id)}
            onChange={(e) => onChange(e.target.checked ? [...chosen, p.id] : chosen.filter((c) => c !== p.id))}
          />
          <label htmlFor={`${id}-${p.id}`} className="font-semibold">
            {p.name} <span className="font-normal text-ink-muted">({p.kind})</span>
          </label>
        </div>
      ))}
    </fieldset>
  );
}

/** Books a job with its survey; the live panel works the volume and dose out as the survey is typed. */
export function NewJobForm({
  products,
  engineers,
  defaultEngineerId,
  today,
}: {
  products: DoseProduct[];
  engineers: EngineerChoice[];
  defaultEngineerId: number | null;
  today: string;
}) {
  const navigate = useNavigate();
  const create = useCreateJob();
  const [siteId, setSiteId] = useState<number | null>(null);
  const [scheduledOn, setScheduledOn] = useState(today);
  const [engineerId, setEngineerId] = useState(defaultEngineerId ? String(defaultEngineerId) : '');
  const [draft, setDraft] = useState<SurveyDraft>(initialSurveyDraft);
  // Until someone types a figure, the heat exchanger follows the boiler kind's default.
  const [heatExchangerEdited, setHeatExchangerEdited] = useState(false);
  const [productIds, setProductIds] = useState<number[]>([]);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const liveSurvey = useMemo(() => draftToLiveSurvey(draft), [draft]);
  const chosenProducts = products.filter((p) => productIds.includes(p.id));
  const set = (patch: Partial<SurveyDraft>) => setDraft((d) => ({ ...d, ...patch }));

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = createJobInputSchema.safeParse({
      siteId: siteId ?? undefined,
      scheduledOn,
      engineerMemberId: engineerId ? Number(engineerId) : null,
      survey: draftToSurveyInput(draft),
      productIds,
    });
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
      onSuccess: (detail) => navigate(paths.job.getHref(detail.job.id)),
      onError: (error) => {
        if (isApiError(error) && error.details.length) setErrors(firstErrorPerField(error.details));
        setFormError(error.message);
      },
    });
  };

  return (
    <div className="grid gap-5 pb-16 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start lg:pb-0">
      <form
        aria-label="Book a job"
        noValidate
        onSubmit={submit}
        className="space-y-6 rounded-xl border border-line bg-card p-4 shadow-sm sm:p-6"
      >
        <CustomerSitePicker siteId={siteId} onSiteChange={setSiteId} siteError={errors.siteId} />

        <fieldset className="space-y-3">
          <legend className="text-lg font-bold text-brand-900">When and who</legend>
          <TextField
            label="Date"
            name="scheduledOn"
            type="date"
            value={scheduledOn}
            onChange={(e) => setScheduledOn(e.target.value)}
            error={errors.scheduledOn}
          />
          <SelectField
            label="Engineer"
            value={engineerId}
            onChange={(e) => setEngineerId(e.target.value)}
            error={errors.engineerMemberId}
            options={[
              { value: '', label: 'Nobody yet' },
              ...engineers.map((m) => ({ value: String(m.memberId), label: m.name })),
            ]}
          />
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="text-lg font-bold text-brand-900">The system</legend>
          <SelectField
            label="System type"
            value={draft.systemType}
            onChange={(e) => set({ systemType: e.target.value as SurveyDraft['systemType'] })}
            options={[
              { value: 'sealed', label: 'Sealed (pressurised)' },
              { value: 'open_vented', label: 'Open-vented (header tank)' },
            ]}
          />
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField
              label="Boiler kind"
              value={draft.boilerKind}
              onChange={(e) => {
                const boilerKind = e.target.value as SurveyDraft['boilerKind'];
                set(
                  heatExchangerEdited
                    ? { boilerKind }
                    : { boilerKind, heatExchangerLitres: String(defaultHeatExchangerLitres[boilerKind]) },
                );
              }}
              options={boilerKinds.map((k) => ({ value: k, label: boilerLabels[k] }))}
            />
            <SelectField
              label="Fuel"
              value={draft.fuel}
              onChange={(e) => set({ fuel: e.target.value as SurveyDraft['fuel'] })}
              options={[
                { value: 'gas', label: 'Gas' },
                { value: 'oil', label: 'Oil' },
                { value: 'other', label: 'Other' },
              ]}
            />
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            <TextField
              label="Heat exchanger (L)"
              name="survey.heatExchangerLitres"
              inputMode="decimal"
              hint={`Default for this boiler kind: ${defaultHeatExchangerLitres[draft.boilerKind]} L`}
              value={draft.heatExchangerLitres}
              onChange={(e) => {
                setHeatExchangerEdited(true);
                set({ heatExchangerLitres: e.target.value });
              }}
              error={errors['survey.heatExchangerLitres']}
            />
            <TextField
              label="Cylinder coil (L)"
              name="survey.cylinderCoilLitres"
              inputMode="decimal"
              hint="Empty if there is no cylinder"
              value={draft.cylinderCoilLitres}
              onChange={(e) => set({ cylinderCoilLitres: e.target.value })}
              error={errors['survey.cylinderCoilLitres']}
            />
            <TextField
              label="Other (L)"
              name="survey.otherLitres"
              inputMode="decimal"
              hint="Buffer vessel, underfloor…"
              value={draft.otherLitres}
              onChange={(e) => set({ otherLitres: e.target.value })}
              error={errors['survey.otherLitres']}
            />
          </div>
        </fieldset>

        <RadiatorRows rows={draft.radiators} onChange={(radiators) => set({ radiators })} errors={errors} />
        <PipeRunRows rows={draft.pipeRuns} onChange={(pipeRuns) => set({ pipeRuns })} errors={errors} />
        <ProductChoices products={products} chosen={productIds} onChange={setProductIds} />

        {formError ? <Alert tone="error">{formError}</Alert> : null}
        <Button type="submit" className="w-full sm:w-auto" busy={create.isPending}>
          Book the job
        </Button>
      </form>
      <div className="lg:sticky lg:top-4">
        <LivePlanPanel survey={liveSurvey} products={chosenProducts} />
      </div>
    </div>
  );
}
