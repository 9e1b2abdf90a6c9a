import {
  cordSizesMm2,
  electricalTestOutcome,
  electricalTestInputSchema,
  type ElectricalTestInput,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextField } from '@/components/ui/text-field';

/** What the electrical test's fields hold, as typed. */
export interface ElectricalDraft {
  equipmentClass: string;
  visual: string;
  earthContinuityOhms: string;
  cordLengthM: string;
  cordSizeMm2: string;
  insulationResistanceMohms: string;
  polarity: string;
  testerUsed: string;
  testerCalibratedOn: string;
}

export const emptyElectrical: ElectricalDraft = {
  equipmentClass: 'I',
  visual: '',
  earthContinuityOhms: '',
  cordLengthM: '',
  cordSizeMm2: '',
  insulationResistanceMohms: '',
  polarity: 'not_applicable',
  testerUsed: '',
  testerCalibratedOn: '',
};

const num = (s: string) => (s.trim() === '' ? null : Number(s));

/** The draft as the API's input (the schema then says what is missing, in words). */
export function electricalInput(d: ElectricalDraft): unknown {
  return {
    equipmentClass: d.equipmentClass,
    visual: d.visual || undefined,
    earthContinuityOhms: d.equipmentClass === 'II' ? null : num(d.earthContinuityOhms),
    cordLengthM: d.equipmentClass === 'II' ? null : num(d.cordLengthM),
    cordSizeMm2: d.equipmentClass === 'II' ? null : num(d.cordSizeMm2),
    insulationResistanceMohms: num(d.insulationResistanceMohms),
    polarity: d.polarity,
    testerUsed: d.testerUsed,
    testerCalibratedOn: d.testerCalibratedOn,
  };
}

/**
 * The in-service inspection and test of an electrical item (IET Code of Practice for In-service Inspection and
 * Testing of Electrical Equipment): the same outcome rule the API applies, shown as the figures are typed.
 */
export function ElectricalTestFields({
  draft,
  onChange,
  errors,
}: {
  draft: ElectricalDraft;
  onChange: (next: ElectricalDraft) => void;
  errors: Record<string, string | undefined>;
}) {
  const set = (patch: Partial<ElectricalDraft>) => onChange({ ...draft, ...patch });
  const parsed = electricalTestInputSchema.safeParse(electricalInput(draft));
  const outcome = parsed.success ? electricalTestOutcome(parsed.data as ElectricalTestInput) : null;
  const err = (k: keyof ElectricalDraft) => errors[`electrical.${k}`];
  const classI = draft.equipmentClass === 'I';
  return (
    <fieldset className="space-y-4 rounded-lg border border-line p-3">
      <legend className="px-1 font-semibold">Electrical inspection and test</legend>
      <p className="text-sm text-ink-muted">
        Only by someone competent to test, with the item unplugged from the supply until tested. Follow the maker&apos;s
        instructions and the firm&apos;s procedure.
      </p>
      <ChoiceGroup
        legend="Class"
        name="electrical-class"
        columns={2}
        value={draft.equipmentClass}
        onChange={(v) => set({ equipmentClass: v })}
        options={[
          { value: 'I', label: 'Class I', hint: 'Earthed: earth continuity is tested' },
          { value: 'II', label: 'Class II', hint: 'Double insulated: no earth test' },
        ]}
      />
      <ChoiceGroup
        legend="Visual check"
        name="electrical-visual"
        columns={2}
        value={draft.visual}
        onChange={(v) => set({ visual: v })}
        error={err('visual')}
        options={[
          { value: 'pass', label: 'Pass', hint: 'Plug, cable, casing and fuse sound' },
          { value: 'fail', label: 'Fail', hint: 'Damage found: no further tests' },
        ]}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        {classI ? (
          <>
            <TextField
              label="Earth continuity (ohms)"
              name="electrical-earth"
              inputMode="decimal"
              autoComplete="off"
              value={draft.earthContinuityOhms}
              onChange={(e) => set({ earthContinuityOhms: e.target.value })}
              error={err('earthContinuityOhms')}
            />
            <TextField
              label="Cord length (metres, optional)"
              name="electrical-cord-length"
              inputMode="decimal"
              autoComplete="off"
              value={draft.cordLengthM}
              onChange={(e) => set({ cordLengthM: e.target.value })}
              hint="With its size, the cord's earth is added to the 0.1 ohm limit."
              error={err('cordLengthM')}
            />
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Cord conductor size (optional)</span>
              <select
                className="min-h-12 w-full rounded-md border border-line-strong bg-card px-3 text-base"
                value={draft.cordSizeMm2}
                onChange={(e) => set({ cordSizeMm2: e.target.value })}
              >
                <option value="">Not given</option>
                {cordSizesMm2.map((s) => (
                  <option key={s} value={String(s)}>
                    {s} mm²
                  </option>
                ))}
              </select>
              {err('cordSizeMm2') ? (
                <span className="text-sm font-semibold text-danger-700">{err('cordSizeMm2')}</span>
              ) : null}
            </label>
          </>
        ) : null}
        <TextField
          label="Insulation resistance (megohms)"
          name="electrical-insulation"
          inputMode="decimal"
          autoComplete="off"
          value={draft.insulationResistanceMohms}
          onChange={(e) => set({ insulationResistanceMohms: e.target.value })}
          error={err('insulationResistanceMohms')}
        />
        <TextField
          label="Tester used"
          name="electrical-tester"
          autoComplete="off"
          value={draft.testerUsed}
          onChange={(e) => set({ testerUsed: e.target.value })}
          error={err('testerUsed')}
        />
        <TextField
          label="Tester calibrated on"
          name="electrical-calibrated"
          type="date"
          value={draft.testerCalibratedOn}
          onChange={(e) => set({ testerCalibratedOn: e.target.value })}
          error={err('testerCalibratedOn')}
        />
      </div>
      <ChoiceGroup
        legend="Polarity"
        name="electrical-polarity"
        value={draft.polarity}
        onChange={(v) => set({ polarity: v })}
        options={[
          { value: 'not_applicable', label: 'Not relevant', hint: 'No socket on it' },
          { value: 'pass', label: 'Pass', hint: 'Lead with plug and socket' },
          { value: 'fail', label: 'Fail' },
        ]}
      />
      {outcome ? (
        <div aria-live="polite">
          <Alert
            tone={outcome.result === 'pass' ? 'success' : 'error'}
            title={outcome.result === 'pass' ? 'Test passed' : 'Test failed: record it as failed'}
          >
            {outcome.result === 'pass'
              ? `Within the limits: ${outcome.earthLimitOhms !== null ? `earth at most ${outcome.earthLimitOhms} Ω, ` : ''}insulation at least ${outcome.insulationMinMohms} MΩ.`
              : `${outcome.failures.join(' ')} A failed test takes the item out of service.`}
          </Alert>
        </div>
      ) : null}
    </fieldset>
  );
}
