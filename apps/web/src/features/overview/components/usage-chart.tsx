import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { Overview } from '@heatfleet/domain';

// One colour per product kind from the palette tokens, so the chart reads like the rest of the app.
const kindColours: Record<string, string> = {
  cleaner: 'var(--color-brand-600)',
  // Darker than the ember accent: the bar and its legend need contrast on white (WCAG 2.2 SC 1.4.11, 1.4.3).
  inhibitor: 'var(--color-ember-600)',
  descaler: 'var(--color-brand-900)',
  leak_sealer: 'var(--color-ember-700)',
  neutraliser: 'var(--color-ok-700)',
  other: 'var(--color-line-strong)',
};

/**
 * Chemical used per month, litres, stacked by product kind; a table under it carries the same figures
 * for screen readers. The kinds' labels and the months' words come in as props: importing the domain package here
 * would make the bundler split it into a shared chunk the first page load then has to fetch.
 */
export function UsageChart({
  months,
  kindLabels,
  monthLabel,
}: {
  months: Overview['usageByMonth'];
  kindLabels: Readonly<Record<string, string>>;
  /** "Dec 26" for '2026-12'. */
  monthLabel: (month: string) => string;
}) {
  const kindLabel = (kind: string) => kindLabels[kind] ?? kind;
  const litresOf = (m: Overview['usageByMonth'][number], kind: string) =>
    m.byKind.find((k) => k.kind === kind)?.litres ?? 0;
  const seen = new Set(months.flatMap((m) => m.byKind.filter((k) => k.litres > 0).map((k) => k.kind)));
  const kinds = [...Object.keys(kindLabels).filter((k) => seen.has(k)), ...[...seen].filter((k) => !(k in kindLabels))];
  const data = months.map((m) => ({
    label: monthLabel(m.month),
    ...Object.fromEntries(m.byKind.map((k) => [k.kind, k.litres])),
  }));
  const total = months.reduce((n, m) => n + m.totalLitres, 0);
  if (total === 0)
    return <p className="text-ink-muted">No chemical has been used on jobs in the last twelve months.</p>;
  return (
    <div>
      <div className="h-64 w-full sm:h-80" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart
            data={data}
            margin={{ top: 8, right: 8, bottom: 0, left: -16 }}
            // The chart is hidden from screen readers (the table below carries the figures), so nothing in it may
            // take focus: recharts' keyboard layer would put a focusable element inside aria-hidden (axe
            // aria-hidden-focus).
            accessibilityLayer={false}
          >
            <CartesianGrid vertical={false} stroke="var(--color-line)" />
            <XAxis dataKey="label" tick={{ fontSize: 12 }} interval="preserveStartEnd" />
            <YAxis tick={{ fontSize: 12 }} unit=" L" allowDecimals={false} />
            <Tooltip formatter={(value, name) => [`${Number(value).toFixed(1)} L`, kindLabel(String(name))]} />
            <Legend formatter={(value: string) => <span className="text-ink">{kindLabel(value)}</span>} />
            {kinds.map((k) => (
              <Bar
                key={k}
                dataKey={k}
                stackId="litres"
                isAnimationActive={false}
                fill={kindColours[k] ?? 'var(--color-line-strong)'}
              />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      {/* A table ignores the 1 px box of sr-only and would widen the page: the wrapper takes it. */}
      <div className="sr-only">
        <table>
          <caption>Chemical used per month, litres</caption>
          <thead>
            <tr>
              <th scope="col">Month</th>
              {kinds.map((k) => (
                <th key={k} scope="col">
                  {kindLabel(k)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {months.map((m) => (
              <tr key={m.month}>
                <th scope="row">{monthLabel(m.month)}</th>
                {kinds.map((k) => (
                  <td key={k}>{litresOf(m, k).toFixed(1)}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-sm text-ink-muted">
        {total.toFixed(1)} litres in the last twelve months, from the packs taken off vans on jobs.
      </p>
    </div>
  );
}
