import type { Knex } from 'knex';
import type { HavAgitation } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

/** Every agitation of the firm's engineers between two firm-zone days (the magnitude copied when recorded). */
export async function listAgitationsBetween(db: Db, firmId: number, from: string, to: string): Promise<HavAgitation[]> {
  const rows = (await db('job_agitations')
    .where('firm_id', firmId)
    .whereBetween('recorded_on', [from, to])
    .whereNotNull('engineer_member_id')
    .select('engineer_member_id', 'recorded_on', 'magnitude_ms2', 'minutes')) as {
    engineer_member_id: number;
    recorded_on: string;
    magnitude_ms2: string | null;
    minutes: number;
  }[];
  return rows.map((r) => ({
    memberId: r.engineer_member_id,
    day: r.recorded_on,
    magnitudeMs2: r.magnitude_ms2 === null ? null : Number(r.magnitude_ms2),
    minutes: Number(r.minutes),
  }));
}

/** The firm's active engineers, and anyone else with vibration recorded in the period (e.g. since moved on). */
export async function listRegisterPeople(
  db: Db,
  firmId: number,
  alsoMemberIds: number[],
): Promise<{ memberId: number; name: string }[]> {
  const rows = (await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.firm_id', firmId)
    .where((w) => {
      w.where({ 'm.role': 'engineer', 'm.active': true });
      if (alsoMemberIds.length) w.orWhereIn('m.id', alsoMemberIds);
    })
    .orderBy('u.name')
    .select('m.id', 'u.name')) as { id: number; name: string }[];
  return rows.map((r) => ({ memberId: r.id, name: r.name }));
}
