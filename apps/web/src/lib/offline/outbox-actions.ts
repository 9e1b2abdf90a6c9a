import { dropDraftIfSame } from '@/lib/offline/drafts';
import { deleteWrite, saveWrite, type QueuedWrite } from '@/lib/offline/outbox';
import { sendOutbox, tellSettled } from '@/lib/offline/outbox-sender';

/** Sends a refused write again as it is (the engineer has put right what the server objected to, say the stock). */
export async function retryWrite(write: QueuedWrite): Promise<void> {
  const { problem: _problem, ...rest } = write;
  await saveWrite({ ...rest, state: 'waiting', attempts: 0 });
  // Its draft went back to the form when it was refused; sent as it is, the form need not offer it again.
  if (write.draftKey && write.draft)
    await dropDraftIfSame(write.draftKey, write.draft, { userId: write.userId, firmId: write.firmId });
  await sendOutbox();
}

/** Drops a write and its draft: the engineer decided it should not happen. */
export async function discardWrite(write: QueuedWrite): Promise<void> {
  await deleteWrite(write);
  if (write.draftKey && write.draft)
    await dropDraftIfSame(write.draftKey, write.draft, { userId: write.userId, firmId: write.firmId });
  tellSettled(write.id, 'discarded');
}

/** "1 change" or "3 changes". */
export function changesText(count: number): string {
  return `${count} change${count === 1 ? '' : 's'}`;
}

/** A time on the phone's clock: "10:42" today, "3 Dec, 10:42" on another day. */
export function shortTime(at: number | string): string {
  const date = new Date(at);
  const time = date.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  if (date.toDateString() === new Date().toDateString()) return time;
  return `${date.toLocaleDateString('en-GB', { day: 'numeric', month: 'short' })}, ${time}`;
}
