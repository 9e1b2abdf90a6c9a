import { useEffect, useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { customerQueries } from '@/features/jobs/api/job-queries';
import { NewCustomer, NewSite } from '@/features/jobs/components/customer-site-forms';

export interface ChosenCustomer {
  id: number;
  name: string;
  sites: { id: number; address: string; postcode: string | null }[];
}

/** The text typed, settled: the search runs once typing pauses, not on every letter. */
function useSettled(text: string, ms = 250): string {
  const [settled, setSettled] = useState(text);
  useEffect(() => {
    const timer = window.setTimeout(() => setSettled(text), ms);
    return () => window.clearTimeout(timer);
  }, [text, ms]);
  return settled;
}

/**
 * The customer by a few letters of their name, postcode or address (the API answers at most 10), and
 * their site: chosen at once when they have one, else one tap among theirs; either can be added here.
 */
export function CustomerSitePicker({
  siteId,
  onSiteChange,
  siteError,
}: {
  siteId: number | null;
  onSiteChange: (siteId: number | null) => void;
  siteError?: string | undefined;
}) {
  const id = useId();
  const [text, setText] = useState('');
  const [customer, setCustomer] = useState<ChosenCustomer | null>(null);
  const [adding, setAdding] = useState<'customer' | 'site' | null>(null);
  const q = useSettled(text.trim());
  const search = useQuery(customerQueries.search(q));

  const choose = (next: ChosenCustomer | null) => {
    setCustomer(next);
    setAdding(next && next.sites.length === 0 ? 'site' : null);
    onSiteChange(next && next.sites.length === 1 ? next.sites[0]!.id : null);
  };

  if (customer) {
    return (
      <fieldset className="space-y-3">
        <legend className="text-lg font-bold text-brand-900">Customer and site</legend>
        <div className="flex items-center justify-between gap-3 rounded-lg border-2 border-brand-700 bg-brand-50 px-3 py-2">
          <p className="min-w-0 font-semibold">{customer.name}</p>
          <Button variant="secondary" className="min-h-12 shrink-0" onClick={() => choose(null)}>
            Change
          </Button>
        </div>
        {customer.sites.length > 0 ? (
          <ChoiceGroup
            legend="Site"
            name={`${id}-site`}
            columns={2}
            value={siteId ? String(siteId) : ''}
            onChange={(value) => onSiteChange(Number(value))}
            options={customer.sites.map((s) => ({
              value: String(s.id),
              label: s.address,
              hint: s.postcode ?? undefined,
            }))}
            error={siteError}
          />
        ) : null}
        {adding === 'site' ? (
          <NewSite
            customerId={customer.id}
            onAdded={(site) => {
              setCustomer({ ...customer, sites: [...customer.sites, site] });
              setAdding(null);
              onSiteChange(site.id);
            }}
          />
        ) : (
          <Button variant="quiet" className="min-h-12" onClick={() => setAdding('site')}>
            A new site for {customer.name}
          </Button>
        )}
      </fieldset>
    );
  }

  const hits = q ? (search.data ?? []) : [];
  return (
    <fieldset className="space-y-3">
      <legend className="text-lg font-bold text-brand-900">Customer and site</legend>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-q`} className="font-semibold">
          Find the customer
        </label>
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          A few letters of the name, the postcode or the address.
        </p>
        <input
          id={`${id}-q`}
          type="search"
          autoComplete="off"
          enterKeyHint="search"
          aria-describedby={`${id}-hint`}
          value={text}
          onChange={(e) => setText(e.target.value)}
          className="min-h-12 w-full rounded-md border-2 border-line-strong bg-card px-3 text-lg"
        />
      </div>
      {q ? (
        <ul aria-label="Matching customers" aria-busy={search.isFetching} className="space-y-2">
          {hits.map((c) => (
            <li key={c.id}>
              <button
                type="button"
                onClick={() => choose({ id: c.id, name: c.name, sites: c.sites })}
                className="flex min-h-12 w-full flex-col justify-center rounded-lg border-2 border-line-strong bg-card px-3 py-2 text-left"
              >
                <span className="font-semibold">{c.name}</span>
                <span className="text-sm text-ink-muted">
                  {c.sites.length
                    ? c.sites.map((s) => [s.address, s.postcode].filter(Boolean).join(', ')).join(' · ')
                    : 'No site yet'}
                </span>
              </button>
            </li>
          ))}
          {!search.isFetching && hits.length === 0 ? <li className="text-ink-muted">No customer matches.</li> : null}
        </ul>
      ) : null}
      {siteError ? <p className="text-sm font-semibold text-danger-700">{siteError}</p> : null}
      {adding === 'customer' ? (
        <NewCustomer onAdded={(c) => choose({ id: c.id, name: c.name, sites: [] })} />
      ) : (
        <Button variant="quiet" className="min-h-12" onClick={() => setAdding('customer')}>
          A new customer
        </Button>
      )}
    </fieldset>
  );
}
