import type { CheckInInput, CheckOutInput, LocationRef, MoveInput } from '@heatfleet/domain';
import { useSignedInMe } from '@/lib/auth';
import { useOutbox, type QueuedWrite } from '@/lib/offline/outbox';
import { useQueueWrite } from '@/lib/offline/queue-write';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

export type CustodyScope = { kind: 'kit'; id: number } | { kind: 'item'; id: number };

export type CustodyRequest =
  | { action: 'check-out'; input: CheckOutInput }
  | { action: 'check-in'; input: CheckInInput }
  | { action: 'move'; input: MoveInput };

/** What a custody write waiting on the phone carries, so the kit's page can show where it is going. */
export interface CustodyMeta {
  scope: CustodyScope;
  action: CustodyRequest['action'];
  to: LocationRef | null;
}

const custodyGroup = 'custody';

/**
 * Custody through the phone's write queue (lib/offline): made at the tap with its Idempotency-Key and tap time,
 * sent at once with signal, kept and sent later without. A check-in's photo is shrunk and uploaded first.
 */
export function useQueuedCustody() {
  const me = useSignedInMe();
  const { queue, isPending } = useQueueWrite();
  const send = (
    scope: CustodyScope,
    request: CustodyRequest,
    options: {
      label: string;
      to: LocationRef | null;
      draftKey: string;
      href: string;
      photo?: { file: File; itemId: number | undefined } | null;
    },
  ) =>
    queue(
      {
        path: `/api/${scope.kind === 'kit' ? 'kits' : 'kit-items'}/${scope.id}/${request.action}`,
        body: request.input,
        label: options.label,
        href: options.href,
        group: custodyGroup,
        meta: { scope, action: request.action, to: options.to } satisfies CustodyMeta,
        draftKey: options.draftKey,
        invalidate: [kitQueries.all(), kitItemQueries.all()],
        ...(options.photo && {
          photo: {
            path: '/api/photos',
            field: 'photo',
            file: options.photo.file,
            ...(options.photo.itemId !== undefined && { fields: { itemId: String(options.photo.itemId) } }),
            idFrom: 'photo.id',
            bodyKey: 'photoId',
          },
        }),
      },
      me,
    );
  return { send, isPending };
}

/** Custody writes of this kit or item still on the phone (waiting, or refused and needing attention), oldest first. */
export function usePendingCustody(targets: { kitId: number | null; itemId: number | null }) {
  const writes = useOutbox();
  return writes
    .filter((write): write is QueuedWrite & { meta: CustodyMeta } => write.group === custodyGroup)
    .filter(({ meta: { scope } }) => (scope.kind === 'kit' ? scope.id === targets.kitId : scope.id === targets.itemId));
}
