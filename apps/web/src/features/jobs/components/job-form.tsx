import { useMemo, useState, type FormEvent, type ReactNode } from 'react';
import { useValuesDraft } from '@/features/jobs/components/use-values-draft';
import {
  boilerKinds,
  builtInHeatExchangerLitres,
  cisternConditionLabels,
  cisternConditions,
  heatExchangerDefaultLitres,
  visitKindLabels,
  visitKinds,
  type HeatExchangerDefaults,
  type SystemDetailsAnswer,
  type VisitKind,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SegmentedChoice } from '@/components/ui/segmented-choice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { FieldErrors } from '@/lib/form';
import { LivePlanPanel, PlanLine, type DoseProduct, type VanStock } from '@/features/jobs/components/live-plan-panel';
import { PipeRunRows } from '@/features/jobs/components/pipe-run-rows';
import { ProductChoices } from '@/features/jobs/components/product-choices';
import { RadiatorCountAdder } from '@/features/jobs/components/radiator-count-adder';
import { RadiatorRows } from '@/features/jobs/components/radiator-rows';
import {
  draftToLiveSurvey,
  draftToSurveyInput,
  radiatorCountLine,
  type SurveyDraft,
} from '@/features/jobs/components/survey-draft';

export interface EngineerChoice {
  memberId: number;
  name: string;
}

export interface SystemDetailsDraft {
  boilerMake: string;
  boilerModel: string;
  boilerLocation: string;
  magneticFilterFitted: '' | 'yes' | 'no';
  cisternCondition: '' | (typeof cisternConditions)[number];
}

export function systemDetailsDraft(a: SystemDetailsAnswer | null): SystemDetailsDraft {
  return {
    boilerMake: a?.boilerMake ?? '',
    boilerModel: a?.boilerModel ?? '',
    boilerLocation: a?.boilerLocation ?? '',
    magneticFilterFitted: a?.magneticFilterFitted == null ? '' : a.magneticFilterFitted ? 'yes' : 'no',
    cisternCondition: a?.cisternCondition ?? '',
  };
}

/** The booking as typed; the page turns it into the create or edit input. */
export interface JobFormValues {
  scheduledOn: string;
  /** 'HH:MM', or empty for no set time. */
  scheduledTime: string;
  engineerId: string;
  visitKind: VisitKind;
  survey: SurveyDraft;
  systemDetails: SystemDetailsDraft;
  productIds: number[];
}

export function jobFormInput(values: JobFormValues) {
  const d = values.systemDetails;
  return {
    scheduledOn: values.scheduledOn,
    scheduledTime: values.scheduledTime.trim() === '' ? null : values.scheduledTime,
    engineerMemberId: values.engineerId ? Number(values.engineerId) : null,
    visitKind: values.visitKind,
    survey: draftToSurveyInput(values.survey),
    productIds: values.productIds,
    systemDetails: {
      boilerMake: d.boilerMake,
      boilerModel: d.boilerModel,
      boilerLocation: d.boilerLocation,
      magneticFilterFitted: d.magneticFilterFitted === '' ? null : d.magneticFilterFitted === 'yes',
      cisternCondition: values.survey.systemType === 'open_vented' && d.cisternCondition ? d.cisternCondition : null,
    },
  };
}

const boilerLabels: Record<(typeof boilerKinds)[number], string> = {
  combi: 'Combi',
  system: 'System',
  regular: 'Regular',
};

/** Rarely changed parts of the form, folded: a tap opens them. */
function Fold({ title, summary, children }: { title: string; summary: string; children: ReactNode }) {
  return (
    <details className="group rounded-lg border-2 border-line-strong">
      <summary className="flex min-h-12 cursor-pointer list-none flex-col justify-center px-3 py-2 [&::-webkit-details-marker]:hidden">
        <span className="font-bold text-brand-900">{title}</span>
        <span className="text-sm text-ink-muted">{summary}</span>
      </summary>
      <div className="space-y-3 px-3 pb-3">{children}</div>
    </details>
  );
}

/**
 * The booking and its survey, phone first: one-tap choices for what is asked every time, the
 * radiators by count, and the rest folded with defaults that are shown. The live plan sits above the
 * button. Used to book a job and to edit a booked one.
 */
export function JobForm({
  initial,
  products,
  engineers,
  heatExchangerDefaults,
  ownDefaults,
  vanStock = null,
  customerPicker,
  submitLabel,
  busy,
  formError,
  errors,
  onSubmit,
  draftKey = null,
}: {
  initial: JobFormValues;
  products: DoseProduct[];
  engineers: EngineerChoice[];
  heatExchangerDefaults: HeatExchangerDefaults | null;
  /** The firm set its own heat exchanger defaults (else the built-in ones, from memory). */
  ownDefaults: boolean;
  vanStock?: VanStock | null;
  customerPicker: ReactNode;
  submitLabel: string;
  busy: boolean;
  formError: string | null;
  errors: FieldErrors;
  onSubmit: (values: JobFormValues) => void;
  /** Kept on the phone under this key from the first change until the server has it (lib/offline/drafts.ts). */
  draftKey?: string | null;
}) {
  const [values, setValues] = useState<JobFormValues>(initial);
  const restoredAt = useValuesDraft(draftKey, values, setValues);
  const survey = values.survey;
  const set = (patch: Partial<JobFormValues>) => setValues((v) => ({ ...v, ...patch }));
  const setSurvey = (patch: Partial<SurveyDraft>) => setValues((v) => ({ ...v, survey: { ...v.survey, ...patch } }));
  const setDetails = (patch: Partial<SystemDetailsDraft>) =>
    setValues((v) => ({ ...v, systemDetails: { ...v.systemDetails, ...patch } }));
  const liveSurvey = useMemo(() => draftToLiveSurvey(survey), [survey]);
  const chosenProducts = products.filter((p) => values.productIds.includes(p.id));
  const defaultLitres = heatExchangerDefaultLitres(
    survey.boilerKind,
    survey.fuel,
    heatExchangerDefaults ?? builtInHeatExchangerLitres,
  );
  const details = values.systemDetails;

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    onSubmit(values);
  };

  return (
    <div className="grid gap-5 pb-16 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start lg:pb-0">
      <form
        aria-label="Book a job"
        noValidate
        onSubmit={submit}
        className="space-y-6 rounded-xl border border-line bg-card p-4 shadow-sm sm:p-6 [&_input:not([type=checkbox]):not([type=radio])]:min-h-12 [&_select]:min-h-12"
      >
        {restoredAt ? (
          <p role="status" className="rounded-md bg-brand-50 px-3 py-2 text-sm font-semibold text-brand-800">
            Brought back what you typed here before (kept on this phone).
          </p>
        ) : null}
        {customerPicker}

        <fieldset className="space-y-3">
          <legend className="text-lg font-bold text-brand-900">When and who</legend>
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Date"
              name="scheduledOn"
              type="date"
              value={values.scheduledOn}
              onChange={(e) => set({ scheduledOn: e.target.value })}
              error={errors.scheduledOn}
            />
            <TextField
              label="Time (optional)"
              name="scheduledTime"
              type="time"
              value={values.scheduledTime}
              onChange={(e) => set({ scheduledTime: e.target.value })}
              error={errors.scheduledTime}
            />
            <SelectField
              label="Engineer"
              value={values.engineerId}
              onChange={(e) => set({ engineerId: e.target.value })}
              error={errors.engineerMemberId}
              options={[
                { value: '', label: 'Nobody yet' },
                ...engineers.map((m) => ({ value: String(m.memberId), label: m.name })),
              ]}
            />
          </div>
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="text-lg font-bold text-brand-900">The visit and the system</legend>
          <SegmentedChoice
            legend="Visit"
            columns={2}
            options={visitKinds.map((k) => ({ value: k, label: visitKindLabels[k] }))}
            value={values.visitKind}
            onChange={(visitKind) =>
              set({
                visitKind,
                // An inhibitor visit doses no cleaner.
                productIds:
                  visitKind === 'inhibitor_only'
                    ? values.productIds.filter((id) => products.find((p) => p.id === id)?.kind !== 'cleaner')
                    : values.productIds,
              })
            }
          />
          <SegmentedChoice
            legend="System"
            columns={2}
            options={[
              { value: 'open_vented', label: 'Open-vented' },
              { value: 'sealed', label: 'Sealed' },
            ]}
            value={survey.systemType}
            onChange={(systemType) => setSurvey({ systemType })}
          />
          <SegmentedChoice
            legend="Boiler"
            options={boilerKinds.map((k) => ({ value: k, label: boilerLabels[k] }))}
            value={survey.boilerKind}
            onChange={(boilerKind) => setSurvey({ boilerKind })}
          />
          <SegmentedChoice
            legend="Fuel"
            options={[
              { value: 'gas', label: 'Gas' },
              { value: 'oil', label: 'Oil' },
              { value: 'other', label: 'Other' },
            ]}
            value={survey.fuel}
            onChange={(fuel) => setSurvey({ fuel })}
          />
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="text-lg font-bold text-brand-900">Radiators</legend>
          <p role="status" aria-label="Radiators listed" className="font-semibold">
            {survey.radiators.length
              ? `${survey.radiators.length} radiators: ${radiatorCountLine(survey.radiators)}`
              : 'No radiators yet: add them by count.'}
          </p>
          <RadiatorCountAdder
            rows={survey.radiators}
            onAdd={(added) => setSurvey({ radiators: [...survey.radiators, ...added] })}
          />
          <Fold title="Rooms and details, one by one" summary="Name the rooms, change a size, add or remove one">
            <RadiatorRows rows={survey.radiators} onChange={(radiators) => setSurvey({ radiators })} errors={errors} />
          </Fold>
        </fieldset>

        <Fold
          title="Pipework"
          summary={
            survey.pipeRuns.length
              ? `${survey.pipeRuns.length} measured run${survey.pipeRuns.length === 1 ? '' : 's'}`
              : 'Quick estimate (no runs measured): open to measure the runs'
          }
        >
          <PipeRunRows rows={survey.pipeRuns} onChange={(pipeRuns) => setSurvey({ pipeRuns })} errors={errors} />
        </Fold>

        <Fold
          title="Boiler and other water"
          summary={`Heat exchanger ${survey.heatExchangerLitres || defaultLitres} L`}
        >
          <TextField
            label="Heat exchanger (L)"
            name="survey.heatExchangerLitres"
            inputMode="decimal"
            hint={`Empty: ${defaultLitres} L, the ${ownDefaults ? 'firm’s default' : 'built-in default (from memory)'} for a ${survey.fuel === 'other' ? 'other-fuel' : survey.fuel} ${boilerLabels[survey.boilerKind].toLowerCase()} boiler. The maker’s figure is better.`}
            value={survey.heatExchangerLitres}
            onChange={(e) => setSurvey({ heatExchangerLitres: e.target.value })}
            error={errors['survey.heatExchangerLitres']}
          />
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Cylinder coil (L)"
              name="survey.cylinderCoilLitres"
              inputMode="decimal"
              hint="Empty if no cylinder"
              value={survey.cylinderCoilLitres}
              onChange={(e) => setSurvey({ cylinderCoilLitres: e.target.value })}
              error={errors['survey.cylinderCoilLitres']}
            />
            <TextField
              label="Other (L)"
              name="survey.otherLitres"
              inputMode="decimal"
              hint="Buffer, underfloor…"
              value={survey.otherLitres}
              onChange={(e) => setSurvey({ otherLitres: e.target.value })}
              error={errors['survey.otherLitres']}
            />
          </div>
        </Fold>

        <Fold
          title="System details for the report"
          summary={
            [details.boilerMake, details.boilerModel].filter(Boolean).join(' ') || 'Boiler make and model, filter'
          }
        >
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Boiler make"
              name="systemDetails.boilerMake"
              value={details.boilerMake}
              onChange={(e) => setDetails({ boilerMake: e.target.value })}
              error={errors['systemDetails.boilerMake']}
            />
            <TextField
              label="Boiler model"
              name="systemDetails.boilerModel"
              value={details.boilerModel}
              onChange={(e) => setDetails({ boilerModel: e.target.value })}
              error={errors['systemDetails.boilerModel']}
            />
          </div>
          <TextField
            label="Boiler location"
            name="systemDetails.boilerLocation"
            value={details.boilerLocation}
            onChange={(e) => setDetails({ boilerLocation: e.target.value })}
            error={errors['systemDetails.boilerLocation']}
          />
          <SegmentedChoice
            legend="Magnetic filter fitted?"
            columns={2}
            options={[
              { value: 'yes', label: 'Yes' },
              { value: 'no', label: 'No' },
            ]}
            value={details.magneticFilterFitted}
            onChange={(magneticFilterFitted) => setDetails({ magneticFilterFitted })}
          />
          {survey.systemType === 'open_vented' ? (
            <SegmentedChoice
              legend="Feed-and-expansion cistern"
              columns={3}
              options={cisternConditions.map((c) => ({ value: c, label: cisternConditionLabels[c] }))}
              value={details.cisternCondition}
              onChange={(cisternCondition) => setDetails({ cisternCondition })}
            />
          ) : null}
        </Fold>

        <ProductChoices
          products={products}
          visitKind={values.visitKind}
          chosen={values.productIds}
          onChange={(productIds) => set({ productIds })}
        />

        <PlanLine
          survey={liveSurvey}
          products={chosenProducts}
          heatExchangerDefaults={heatExchangerDefaults}
          vanStock={vanStock}
        />
        {formError ? <Alert tone="error">{formError}</Alert> : null}
        <Button type="submit" className="min-h-14 w-full text-lg sm:w-auto" busy={busy}>
          {submitLabel}
        </Button>
      </form>
      <div className="lg:sticky lg:top-4">
        <LivePlanPanel survey={liveSurvey} products={chosenProducts} heatExchangerDefaults={heatExchangerDefaults} />
      </div>
    </div>
  );
}
