import { useCallback, useState } from 'react';
import type { Me } from '@heatfleet/domain';
import { randomUuid } from '@/lib/idempotency';
import { serverNow } from '@/lib/offline/data-age';
import { clearDraft, loadDraft } from '@/lib/offline/drafts';
import { nextSeq, saveWrite, type QueuedForm, type QueuedUpload, type QueuedWrite } from '@/lib/offline/outbox';
import { awaitFirstAttempt, awaitSettled, sendOutbox, type Settled } from '@/lib/offline/outbox-sender';
import { shrinkPhoto } from '@/lib/offline/shrink-photo';

/** A write as a form hands it to the queue (DEVELOPERS.md, Working offline: how a form adopts the queue). */
export interface WriteRequest {
  method?: QueuedWrite['method'];
  path: string;
  body: unknown;
  /** What it is, in the engineer's words, for the status line and the attention list: "Check out Rig 4 to Van 1". */
  label: string;
  /** The page it was made on. */
  href?: string;
  group?: string;
  meta?: unknown;
  /** The form's draft (lib/offline/use-form-draft.ts): it moves into the write, and back if the server refuses. */
  draftKey?: string;
  /** Query keys to refresh once the server has it. */
  invalidate?: readonly (readonly unknown[])[];
  /** A photo to upload first, shrunk on the phone; its id goes in the body. */
  photo?: Omit<QueuedUpload, 'file' | 'fileName' | 'uploadedId'> & { file: Blob };
  /** The write is itself a photo upload (multipart to `path`), shrunk on the phone first. */
  form?: Omit<QueuedForm, 'file' | 'fileName'> & { file: Blob };
}

export type WriteOutcome =
  | { status: 'sent'; body: unknown }
  | {
      status: 'queued';
      id: string;
      /** offline; network (it failed on the way); signed-out; other-firm; other-person */
      why: string;
      /** Resolves when the queue has sent it, or the server refused it (attention), or it was discarded. */
      settled: Promise<Settled>;
    };

/**
 * Queues a write and, with signal, sends the queue at once. Resolves as soon as the write is safe: sent (with the
 * server's answer), or kept on the phone to be sent later. Rejects with the server's ApiError when the server
 * refuses it on the spot, so the form shows why beside its fields; nothing is kept then but the draft.
 */
export async function queueWrite(request: WriteRequest, me: Me): Promise<WriteOutcome> {
  const idempotencyKey = randomUuid();
  const tappedAt = new Date(serverNow()).toISOString();
  const write: QueuedWrite = {
    id: idempotencyKey,
    seq: nextSeq(),
    userId: me.user.id,
    firmId: me.activeFirm.id,
    firmName: me.activeFirm.name,
    method: request.method ?? 'POST',
    path: request.path,
    body: request.body,
    idempotencyKey,
    tappedAt,
    label: request.label,
    state: 'waiting',
    attempts: 0,
    ...(request.href !== undefined && { href: request.href }),
    ...(request.group !== undefined && { group: request.group }),
    ...(request.meta !== undefined && { meta: request.meta }),
    ...(request.draftKey !== undefined && { draftKey: request.draftKey }),
    ...(request.invalidate !== undefined && { invalidate: request.invalidate }),
  };
  if (request.photo) {
    const { file, ...rest } = request.photo;
    const shrunk = await shrinkPhoto(file);
    write.upload = { ...rest, file: shrunk, fileName: shrunk.name };
  }
  if (request.form) {
    const { file, ...rest } = request.form;
    const shrunk = await shrinkPhoto(file);
    write.form = { ...rest, file: shrunk, fileName: shrunk.name };
  }
  const draft = write.draftKey ? await loadDraft(write.draftKey) : undefined;
  if (draft) write.draft = draft;
  const first = awaitFirstAttempt(write.id);
  const settled = awaitSettled(write.id);
  // Kept in the queue first, then the form's draft goes: a crash in between leaves both, never neither.
  await saveWrite(write);
  if (write.draftKey) await clearDraft(write.draftKey);
  void sendOutbox();
  const outcome = await first;
  if (outcome.kind === 'sent') return { status: 'sent', body: outcome.body };
  if (outcome.kind === 'refused') throw outcome.error;
  return { status: 'queued', id: write.id, why: outcome.why, settled };
}

/** queueWrite for a form: pending while the first attempt is under way. */
export function useQueueWrite() {
  const [isPending, setPending] = useState(false);
  const queue = useCallback(async (request: WriteRequest, me: Me) => {
    setPending(true);
    try {
      return await queueWrite(request, me);
    } finally {
      setPending(false);
    }
  }, []);
  return { queue, isPending };
}

/** The sentence a form shows when its write is kept on the phone; `what` is a phrase such as "the check-out". */
export function queuedMessage(what: string, why: string): string {
  const What = what.charAt(0).toUpperCase() + what.slice(1);
  if (why === 'offline') return `No signal: ${what} is saved on this phone and goes when the signal returns.`;
  if (why === 'signed-out') return `${What} is saved on this phone; sign in again to send it.`;
  if (why === 'other-firm') return `${What} is saved on this phone; it goes once you are back in its firm.`;
  return `Heatfleet could not reach its server. ${What} is saved on this phone and goes as soon as it can.`;
}
