import { formatPence, formatVatRate, type PublicQuote } from '@heatfleet/domain';

type Lines = Pick<PublicQuote, 'lines' | 'netPence' | 'vatPence' | 'totalPence' | 'vatRegistered'>;

/** A quote's or invoice's lines and totals; with no VAT columns when the firm is not VAT registered. */
export function MoneyLinesTable({ doc }: { doc: Lines }) {
  const vat = doc.vatRegistered;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead>
          <tr className="border-b">
            <th className="py-2 pr-2">Description</th>
            <th className="py-2 pr-2 text-right">Qty</th>
            <th className="py-2 pr-2 text-right">{vat ? 'Unit price excl. VAT' : 'Unit price'}</th>
            {vat ? <th className="py-2 pr-2 text-right">VAT</th> : null}
            <th className="py-2 text-right">{vat ? 'Amount excl. VAT' : 'Amount'}</th>
          </tr>
        </thead>
        <tbody>
          {doc.lines.map((l, i) => (
            <tr key={i} className="border-b">
              <td className="py-2 pr-2">{l.description}</td>
              <td className="py-2 pr-2 text-right">{l.quantity}</td>
              <td className="py-2 pr-2 text-right">{formatPence(l.unitPence)}</td>
              {vat ? (
                <td className="py-2 pr-2 text-right">
                  {formatPence(l.vatPence)} ({formatVatRate(l.vatRateBp)})
                </td>
              ) : null}
              <td className="py-2 text-right">{formatPence(l.netPence)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <dl className="mt-3 grid grid-cols-2 gap-1 text-right">
        {vat ? (
          <>
            <dt>Total excluding VAT</dt>
            <dd>{formatPence(doc.netPence)}</dd>
            <dt>VAT</dt>
            <dd>{formatPence(doc.vatPence)}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Total{vat ? '' : ' (no VAT charged)'}</dt>
        <dd className="font-semibold">{formatPence(doc.totalPence)}</dd>
      </dl>
    </div>
  );
}
