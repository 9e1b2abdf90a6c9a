import { custodyActionLabels, itemConditionLabels, type CustodyEvent } from '@heatfleet/domain';
import { formatDateTime } from '@/lib/format';
import { locationText } from '@/features/kits/components/location-text';

const marks: Record<CustodyEvent['action'], string> = {
  check_out: 'bg-brand-600',
  check_in: 'bg-ok-700',
  move: 'bg-ember-500',
};

/** The engineer's time first: when it was done on the phone, and when it arrived if that was a minute or more later. */
function When({ event, timeZone }: { event: CustodyEvent; timeZone: string }) {
  const tapped = event.tappedAt;
  if (!tapped || Date.parse(event.createdAt) - Date.parse(tapped) < 60_000) {
    return <time dateTime={tapped ?? event.createdAt}>{formatDateTime(tapped ?? event.createdAt, timeZone)}</time>;
  }
  return (
    <>
      Done <time dateTime={tapped}>{formatDateTime(tapped, timeZone)}</time> (sent from the phone{' '}
      <time dateTime={event.createdAt}>{formatDateTime(event.createdAt, timeZone)}</time>)
    </>
  );
}

function route(event: CustodyEvent): string {
  const from = event.from ? locationText(event.from) : null;
  const to = event.to ? locationText(event.to) : null;
  if (from && to) return `${from} → ${to}`;
  return to ?? from ?? '';
}

/**
 * The custody log, newest first. A kit's check-out writes one event per item; on a kit's page
 * those show as one line with the count, since they happened together.
 */
export function CustodyTimeline({
  events,
  timeZone,
  groupByKit = false,
}: {
  events: CustodyEvent[];
  timeZone: string;
  groupByKit?: boolean;
}) {
  const sorted = [...events].sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.id - a.id);
  const rows: { event: CustodyEvent; tags: string[] }[] = [];
  for (const event of sorted) {
    const previous = rows.at(-1);
    if (
      groupByKit &&
      previous &&
      event.kitId !== null &&
      previous.event.kitId === event.kitId &&
      previous.event.action === event.action &&
      previous.event.createdAt === event.createdAt
    ) {
      previous.tags.push(event.item.assetTag);
    } else {
      rows.push({ event, tags: [event.item.assetTag] });
    }
  }
  if (rows.length === 0) return <p className="text-ink-muted">Nothing has been checked out or in yet.</p>;

  return (
    <ol aria-label="Custody timeline" className="space-y-0">
      {rows.map(({ event, tags }) => (
        <li key={event.id} className="relative border-l-2 border-line pb-4 pl-5 last:pb-0">
          <span
            aria-hidden="true"
            className={`absolute top-1.5 -left-[7px] size-3 rounded-full ${marks[event.action]}`}
          />
          <p className="font-semibold">
            {custodyActionLabels[event.action]}
            <span className="font-normal"> · {route(event)}</span>
          </p>
          <p className="text-sm text-ink-muted">
            <When event={event} timeZone={timeZone} /> by {event.byName}
            {groupByKit ? ` · ${tags.length === 1 ? tags[0] : `${tags.length} items`}` : ''}
          </p>
          {event.condition ? <p className="text-sm">Condition: {itemConditionLabels[event.condition]}</p> : null}
          {event.missingParts ? <p className="text-sm text-ember-700">Missing: {event.missingParts}</p> : null}
          {event.overdueReason ? (
            <p className="text-sm text-ember-700">Out before inspection: {event.overdueReason}</p>
          ) : null}
          {event.note ? <p className="text-sm whitespace-pre-line">{event.note}</p> : null}
          {event.photoId ? (
            <a
              href={`/api/photos/${event.photoId}/content`}
              target="_blank"
              rel="noreferrer"
              className="text-sm text-brand-700 underline"
            >
              Photo
            </a>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
