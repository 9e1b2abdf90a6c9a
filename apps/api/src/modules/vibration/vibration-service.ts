import { ForbiddenError } from '@casl/ability';
import { addDays, havRegister, weekStartOf, type HavRegisterQuery, type HavRegisterResponse } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { firmToday } from '../firms/firm-today.ts';
import { listAgitationsBetween, listRegisterPeople } from './vibration-dal.ts';

/**
 * The hand-arm vibration register for those who run the firm (Owner and Admin: the people who change the
 * firm's settings), who arrange health surveillance under the Control of Vibration at Work Regulations 2005.
 * The rule, the points and the flags are the domain's `havRegister`.
 */
export async function getHavRegister(
  deps: AppDeps,
  actor: Actor,
  query: HavRegisterQuery,
): Promise<HavRegisterResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Firm');
  const to = query.to ?? (await firmToday(deps.db, actor.firmId, deps.clock.now()));
  const from = addDays(weekStartOf(to), -7 * (query.weeks - 1));
  const agitations = await listAgitationsBetween(deps.db, actor.firmId, from, addDays(weekStartOf(to), 6));
  const people = await listRegisterPeople(deps.db, actor.firmId, [...new Set(agitations.map((a) => a.memberId))]);
  return havRegister({ to, weeks: query.weeks, engineers: people, agitations });
}
