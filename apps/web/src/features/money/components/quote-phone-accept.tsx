import { useState } from 'react';
import {
  CANCELLATION_PERIOD_DAYS,
  EXPRESS_REQUEST_WORDS,
  type Quote,
  type QuotePhoneAcceptInput,
} from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { SignatureBox } from '@/components/ui/signature-box';
import { TextField } from '@/components/ui/text-field';

// The customer accepts on the engineer's phone: their name, a tick, whether they ask for the work within the
// cancellation period (regulation 36 of the Consumer Contracts (Information, Cancellation and Additional Charges)
// Regulations 2013), and their drawn signature. The API checks each of these again (quotePhoneAcceptInputSchema).

export function QuotePhoneAccept({
  quote,
  busy,
  error,
  onAccept,
}: {
  quote: Quote;
  busy: boolean;
  error: string | null;
  onAccept: (input: QuotePhoneAcceptInput) => void;
}) {
  const [name, setName] = useState(quote.customerName);
  const [agree, setAgree] = useState(false);
  const [express, setExpress] = useState(false);
  const [png, setPng] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const shown = problem ?? error;
  return (
    <form
      className="space-y-4"
      aria-label="Customer accepts here"
      onSubmit={(e) => {
        e.preventDefault();
        if (!name.trim()) return setProblem("Write the customer's name.");
        if (!agree) return setProblem('The customer ticks the box to accept the quote.');
        if (!png) return setProblem('The customer signs in the box.');
        setProblem(null);
        onAccept({ name: name.trim(), agree: true, expressRequest: express, imagePngDataUrl: png });
      }}
    >
      <p className="text-ink-muted">Hand the phone to the customer.</p>
      <TextField
        label="The customer's name"
        name="acceptName"
        autoComplete="off"
        value={name}
        onChange={(e) => {
          setName(e.target.value);
          setProblem(null);
        }}
      />
      <label className="flex min-h-12 items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 h-6 w-6"
          checked={agree}
          onChange={(e) => {
            setAgree(e.target.checked);
            setProblem(null);
          }}
        />
        <span>I accept quote {quote.number} for the work and prices above.</span>
      </label>
      <div className="space-y-2 rounded-lg border border-line bg-brand-50 p-3 text-sm">
        <p>
          <strong>Your right to cancel:</strong> because you agreed this in your home, you may cancel within{' '}
          {CANCELLATION_PERIOD_DAYS} days without giving a reason. We will not start the work in those{' '}
          {CANCELLATION_PERIOD_DAYS} days unless you ask us to. If you ask and then cancel, you pay for the part already
          done; once the work is finished you can no longer cancel.
        </p>
      </div>
      <label className="flex min-h-12 items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 h-6 w-6"
          checked={express}
          onChange={(e) => setExpress(e.target.checked)}
        />
        <span>{EXPRESS_REQUEST_WORDS} (optional)</span>
      </label>
      <SignatureBox
        label="The customer signs to accept"
        onChange={(drawn) => {
          setPng(drawn);
          setProblem(null);
        }}
        disabled={busy}
      />
      {shown ? (
        <p role="alert" className="font-semibold text-danger-700">
          {shown}
        </p>
      ) : null}
      <Button type="submit" className="min-h-12 w-full" busy={busy}>
        Accept the quote
      </Button>
    </form>
  );
}
