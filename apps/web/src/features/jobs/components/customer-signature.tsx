import { useState } from 'react';
import { signatureKindLabels, type JobSignature, type SignatureKind } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { SignatureBox } from '@/components/ui/signature-box';
import { TextField } from '@/components/ui/text-field';
import { formatClock } from '@/features/jobs/components/sheet-format';

/** A stored signature on one line, with its image. */
export function SignedLine({ signature, timeZone }: { signature: JobSignature; timeZone: string }) {
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-ok-700 bg-ok-50 px-3 py-2">
      <img
        src={signature.url}
        alt={`Signature of ${signature.name}`}
        className="h-12 w-28 rounded border border-line bg-card object-contain"
      />
      <p className="min-w-0 flex-1 font-semibold text-ok-700">
        ✓ {signature.kind === 'acknowledgement' ? 'Acknowledged' : 'Accepted'} by {signature.name} at{' '}
        {formatClock(signature.signedAt, timeZone)}
      </p>
    </div>
  );
}

export interface SignatureDraft {
  name: string;
  pngDataUrl: string | null;
}

/** The customer's name (filled in from the booking) and their drawn signature, on the engineer's phone. */
export function SignatureFields({
  kind,
  draft,
  onChange,
  error,
}: {
  kind: SignatureKind;
  draft: SignatureDraft;
  onChange: (draft: SignatureDraft) => void;
  error?: string | null;
}) {
  return (
    <div className="space-y-3">
      <p className="font-semibold text-brand-900">{signatureKindLabels[kind]}.</p>
      <TextField
        label="The customer's name"
        name={`${kind}.name`}
        autoComplete="off"
        className="[&_input]:min-h-12"
        value={draft.name}
        onChange={(e) => onChange({ ...draft, name: e.target.value })}
      />
      <SignatureBox
        label={kind === 'acknowledgement' ? 'The customer signs to acknowledge' : 'The customer signs to accept'}
        onChange={(pngDataUrl) => onChange({ ...draft, pngDataUrl })}
      />
      {error ? <Alert tone="error">{error}</Alert> : null}
    </div>
  );
}

export function useSignatureDraft(defaultName: string) {
  return useState<SignatureDraft>({ name: defaultName, pngDataUrl: null });
}
