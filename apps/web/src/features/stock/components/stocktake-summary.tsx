import type { StockMoved, StockPlace } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';

export interface CountedLine {
  key: string;
  product: string;
  lotNumber: string;
  recorded: number;
  counted: number;
}

const signed = (n: number) => (n > 0 ? `+${n}` : String(n));

/** After a stocktake: what was counted against the record (now shown) and the adjustments written. */
export function StocktakeSummary({
  place,
  answer,
  lines,
}: {
  place: StockPlace;
  answer: StockMoved;
  lines: CountedLine[];
}) {
  const adjusted = lines.filter((l) => l.counted !== l.recorded);
  return (
    <section aria-label="Stocktake summary" className="space-y-3 rounded-lg border border-line bg-card p-3">
      <Alert tone="success">
        {answer.movements.length === 0
          ? `Stocktake of ${place.name} saved: everything matched, nothing was adjusted.`
          : `Stocktake of ${place.name} saved: ${answer.movements.length} adjustment${answer.movements.length === 1 ? '' : 's'}.`}
      </Alert>
      {adjusted.length > 0 ? (
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">Adjustments made by the stocktake</caption>
          <thead>
            <tr className="border-b border-line">
              <th scope="col" className="py-1 pr-2">
                Product and lot
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                Recorded
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                Counted
              </th>
              <th scope="col" className="py-1 text-right">
                Adjustment
              </th>
            </tr>
          </thead>
          <tbody>
            {adjusted.map((l) => (
              <tr key={l.key} className="border-b border-line">
                <th scope="row" className="py-1 pr-2 font-semibold [overflow-wrap:anywhere]">
                  {l.product} <span className="font-mono font-normal">{l.lotNumber}</span>
                </th>
                <td className="py-1 pr-2 text-right">{l.recorded}</td>
                <td className="py-1 pr-2 text-right">{l.counted}</td>
                <td className="py-1 text-right font-bold">{signed(l.counted - l.recorded)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}
