import { useState } from 'react';
import { formatPence, priceItemInputSchema, priceVisitKindLabels, type PriceItem } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useAbility } from '@/lib/ability';
import { useSavePriceItem } from '../api/price-invoice-actions';
import { PriceItemForm, type ProductChoice } from './price-item-form';

const kindHeadings = { visit: 'Visits', chemical: 'Chemicals', extra: 'Extras' } as const;

/** What a price says in one line: "£60.00 + £10.00 a radiator", "up to 5: £150.00; up to 10: £220.00", "£12.50 each". */
export function priceSummary(item: PriceItem): string {
  if (item.kind !== 'visit')
    return `${formatPence(item.unitPence)} each${item.productName ? ` (${item.productName})` : ''}`;
  const kind = item.visitKind ? `${priceVisitKindLabels[item.visitKind]}: ` : '';
  if (item.pricing === 'bands') {
    const bands = item.bands.map((b) => `up to ${b.upToRadiators}: ${formatPence(b.pricePence)}`).join('; ');
    const beyond = item.perRadiatorPence ? `; then ${formatPence(item.perRadiatorPence)} a radiator` : '';
    return `${kind}${bands}${beyond}`;
  }
  return `${kind}${formatPence(item.basePence)} + ${formatPence(item.perRadiatorPence)} a radiator`;
}

/** Taking a price off the list keeps it on quotes and invoices already made (the API has no delete: it is set inactive). */
function toInput(item: PriceItem, active: boolean) {
  return priceItemInputSchema.parse({
    kind: item.kind,
    name: item.name,
    visitKind: item.visitKind,
    pricing: item.pricing,
    basePence: item.basePence,
    perRadiatorPence: item.perRadiatorPence,
    bands: item.bands,
    productId: item.productId,
    unitPence: item.unitPence,
    active,
  });
}

export function PriceItemsList({ items, products }: { items: PriceItem[]; products: readonly ProductChoice[] }) {
  const canEdit = useAbility().can('update', 'PriceList');
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const toggle = useSavePriceItem();
  return (
    <div className="space-y-5">
      {toggle.isError ? <Alert tone="error">{toggle.error.message}</Alert> : null}
      {(['visit', 'chemical', 'extra'] as const).map((kind) => {
        const ofKind = items.filter((i) => i.kind === kind);
        return (
          <section key={kind} className="space-y-2" aria-label={kindHeadings[kind]}>
            <h3 className="font-semibold">{kindHeadings[kind]}</h3>
            {ofKind.length === 0 ? <p className="text-sm text-ink-muted">None yet.</p> : null}
            <ul className="divide-y rounded-md border">
              {ofKind.map((item) => (
                <li key={item.id} className="space-y-2 p-3">
                  {editing === item.id ? (
                    <PriceItemForm item={item} products={products} onDone={() => setEditing(null)} />
                  ) : (
                    <div className="flex flex-wrap items-center justify-between gap-2">
                      <div className={item.active ? '' : 'text-ink-muted'}>
                        <p className="font-semibold">
                          {item.name}
                          {item.active ? '' : ' (removed)'}
                        </p>
                        <p className="text-sm">{priceSummary(item)}</p>
                      </div>
                      {canEdit ? (
                        <div className="flex gap-2">
                          <Button
                            variant="secondary"
                            aria-label={`Change ${item.name}`}
                            onClick={() => setEditing(item.id)}
                          >
                            Change
                          </Button>
                          <Button
                            variant={item.active ? 'danger' : 'secondary'}
                            aria-label={`${item.active ? 'Remove' : 'Restore'} ${item.name}`}
                            busy={toggle.isPending && toggle.variables.id === item.id}
                            onClick={() => toggle.mutate({ id: item.id, input: toInput(item, !item.active) })}
                          >
                            {item.active ? 'Remove' : 'Restore'}
                          </Button>
                        </div>
                      ) : null}
                    </div>
                  )}
                </li>
              ))}
            </ul>
          </section>
        );
      })}
      {canEdit ? (
        editing === 'new' ? (
          <div className="rounded-md border p-3">
            <PriceItemForm item={null} products={products} onDone={() => setEditing(null)} />
          </div>
        ) : (
          <Button onClick={() => setEditing('new')}>Add a price</Button>
        )
      ) : null}
    </div>
  );
}
