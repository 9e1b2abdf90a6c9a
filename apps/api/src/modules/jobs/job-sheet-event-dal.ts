import type { Knex } from 'knex';

// The job sheet's event log (job_sheet_events): every write as it arrived, append-only. The sheet's own tables
// hold the latest of each target by the engineer's time (the tap, else the arrival), so a later value wins and
// the earlier is kept here. Runs in the caller's transaction, under the job row's lock.

export interface SheetEvent {
  firmId: number;
  jobId: number;
  /** What was written: "reading:3:before", "agitation:3", "flush:3", "step:flush", "water-tests", "kit". */
  target: string;
  value: unknown;
  tappedAt: Date | null;
  now: Date;
  userId: number;
}

/**
 * Logs the event and says whether it is the latest for its target (then the caller applies it). One done earlier
 * than what the sheet already holds (a write that waited on a phone while another person's later one arrived) is
 * kept in the log and changes nothing.
 */
export async function logSheetEvent(trx: Knex.Transaction, event: SheetEvent): Promise<boolean> {
  const at = event.tappedAt ?? event.now;
  const latest = (await trx('job_sheet_events')
    .where({ firm_id: event.firmId, job_id: event.jobId, target: event.target })
    .max({ at: trx.raw('coalesce(tapped_at, recorded_at)') })
    .first()) as { at: Date | string | null } | undefined;
  const latestAt = latest?.at ? new Date(latest.at) : null;
  const applied = latestAt === null || at.getTime() >= latestAt.getTime();
  await trx('job_sheet_events').insert({
    firm_id: event.firmId,
    job_id: event.jobId,
    target: event.target,
    value: JSON.stringify(event.value ?? null),
    applied,
    tapped_at: event.tappedAt,
    recorded_at: event.now,
    recorded_by_user_id: event.userId,
  });
  return applied;
}
