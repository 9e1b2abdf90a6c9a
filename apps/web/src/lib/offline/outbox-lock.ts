// One lock for sending the write queue and for changing the session (sign-in, sign-out, switching firm): the queue
// checks the active firm, then sends, and no switch can come in between, in this tab or another (the Web Locks API
// is shared by every tab of the site). Without it (plain http off localhost) the lock holds within this tab only.
const LOCK_NAME = 'heatfleet-outbox';
let tail: Promise<unknown> = Promise.resolve();

export function withOutboxLock<T>(work: () => Promise<T>): Promise<T> {
  if (typeof navigator !== 'undefined' && navigator.locks) return navigator.locks.request(LOCK_NAME, work);
  const run = tail.then(work, work);
  tail = run.catch(() => undefined);
  return run;
}
