import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPence, invoiceStateLabels, type Invoice } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useAbility } from '@/lib/ability';
import { formatCalendarDate, formatDateTime } from '@/lib/format';
import { invoicePdfHref } from '../api/money-queries';
import { useIssueInvoice } from '../api/price-invoice-actions';
import { InvoiceCreditForm } from './invoice-credit-form';
import { InvoiceLinesEditor } from './invoice-lines-editor';
import { MoneyLinesTable } from './money-lines-table';

const link = 'inline-flex min-h-12 items-center font-semibold text-brand-700 underline';

function Figures({ invoice, timeZone }: { invoice: Invoice; timeZone: string }) {
  const rows: Array<[string, string, string?]> = [
    ['Number', invoice.number ?? 'Not issued yet', 'invoice-number'],
    ['State', invoiceStateLabels[invoice.status], 'invoice-state'],
    ['Customer', `${invoice.customerName}, ${invoice.customerAddress}`],
    ['Issued', invoice.issuedAt ? formatDateTime(invoice.issuedAt, timeZone) : '—'],
    ['Due by', invoice.dueOn ? formatCalendarDate(invoice.dueOn.slice(0, 10)) : '—'],
    ['Total', formatPence(invoice.totalPence), 'invoice-total'],
    ['Paid', formatPence(invoice.paidPence)],
    ['Credited', formatPence(invoice.creditedPence)],
    ['Still owed', formatPence(invoice.duePence), 'invoice-due'],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
      {rows.map(([label, value, testId]) => (
        <div key={label}>
          <dt className="text-sm text-ink-muted">{label}</dt>
          <dd className="font-semibold" data-testid={testId}>
            {value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

function IssueButton({ invoice }: { invoice: Invoice }) {
  const issue = useIssueInvoice(invoice.id);
  const [asking, setAsking] = useState(false);
  if (!asking) return <Button onClick={() => setAsking(true)}>Issue invoice</Button>;
  return (
    <Alert tone="info" title="An issued invoice cannot be changed">
      It takes the next invoice number and is e-mailed to the customer with a pay link; a mistake afterwards needs a
      credit note.
      {issue.isError ? <span className="mt-2 block font-semibold">{issue.error.message}</span> : null}
      <span className="mt-3 flex flex-wrap gap-3">
        <Button busy={issue.isPending} onClick={() => issue.mutate(undefined, { onSuccess: () => setAsking(false) })}>
          Yes, issue it
        </Button>
        <Button variant="secondary" onClick={() => setAsking(false)}>
          Not yet
        </Button>
      </span>
    </Alert>
  );
}

/** An invoice's own page: its figures, lines (editable while a draft), issuing, PDF, payments and credit notes. */
export function InvoiceDetail({ invoice, timeZone }: { invoice: Invoice; timeZone: string }) {
  const ability = useAbility();
  const canUpdate = ability.can('update', 'Invoice');
  const draft = invoice.status === 'draft';
  return (
    <div className="space-y-5">
      <Card>
        <Figures invoice={invoice} timeZone={timeZone} />
        <div className="mt-4 flex flex-wrap gap-4">
          <a className={link} href={invoicePdfHref(invoice.id)}>
            Download the PDF
          </a>
          {!draft && invoice.duePence > 0 ? (
            <Link className={buttonClasses('secondary')} to={paths.invoicePayment.getHref(invoice.id)}>
              Take payment
            </Link>
          ) : null}
        </div>
      </Card>
      <Card
        title="Lines"
        description={draft ? 'A draft: change its lines, then issue it.' : 'Issued: these lines never change.'}
      >
        {draft && canUpdate ? (
          <InvoiceLinesEditor key={invoice.lines.map((l) => l.id).join()} invoice={invoice} />
        ) : null}
        <div className={draft && canUpdate ? 'mt-4' : ''}>
          <MoneyLinesTable doc={invoice} />
        </div>
        {draft && canUpdate ? (
          <div className="mt-4">
            <IssueButton invoice={invoice} />
          </div>
        ) : null}
      </Card>
      {invoice.creditNotes.length ? (
        <Card title="Credit notes">
          <ul className="space-y-2">
            {invoice.creditNotes.map((c) => (
              <li key={c.id}>
                <a className={link} href={`/api/credit-notes/${c.id}/credit-note.pdf`}>
                  {c.number}: {formatPence(c.totalPence)}, {c.reason}
                </a>
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      {!draft && canUpdate && invoice.status !== 'credited' ? (
        <Card
          title="Correct with a credit note"
          description="An issued invoice is never changed; a credit note corrects it."
        >
          <InvoiceCreditForm invoice={invoice} />
        </Card>
      ) : null}
    </div>
  );
}
