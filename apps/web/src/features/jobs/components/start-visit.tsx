import { signatureInputSchema, type JobDetail } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { useAddSignature } from '@/features/jobs/api/use-job-sheet-mutations';
import { JobCautions } from '@/features/jobs/components/job-cautions';
import { SignatureFields, SignedLine, useSignatureDraft } from '@/features/jobs/components/customer-signature';

/**
 * Before the work: the cautions that fit this system and fuel, then the customer's acknowledgement
 * that cleaning can reveal weak radiators, valves or joints, drawn on the phone and stored with the time.
 */
export function StartVisit({ detail, timeZone }: { detail: JobDetail; timeZone: string }) {
  const { sheet } = detail;
  const signed = sheet.signatures.find((s) => s.kind === 'acknowledgement');
  const [draft, setDraft] = useSignatureDraft(detail.job.site.customerName);
  const add = useAddSignature(detail.job.id);
  const parsed = signatureInputSchema.safeParse({
    kind: 'acknowledgement',
    name: draft.name,
    imagePngDataUrl: draft.pngDataUrl ?? '',
  });
  return (
    <div className="space-y-4">
      <JobCautions cautions={sheet.cautions} />
      {signed ? (
        <SignedLine signature={signed} timeZone={timeZone} />
      ) : sheet.editable ? (
        <div role="group" aria-label="The customer's acknowledgement" className="space-y-3">
          <SignatureFields
            kind="acknowledgement"
            draft={draft}
            onChange={(next) => {
              add.reset();
              setDraft(next);
            }}
            error={add.error?.message ?? null}
          />
          <Button
            className="min-h-14 w-full text-lg"
            busy={add.isPending}
            disabled={!parsed.success}
            onClick={() => parsed.success && add.mutate(parsed.data)}
          >
            Signed: start the work
          </Button>
        </div>
      ) : (
        <p className="text-ink-muted">The customer did not sign before the work.</p>
      )}
    </div>
  );
}

export function startSummary(detail: JobDetail): string {
  const signed = detail.sheet.signatures.find((s) => s.kind === 'acknowledgement');
  return signed ? `Acknowledged by ${signed.name}` : 'The customer signs before the work';
}
