import { ForbiddenError, subject } from '@casl/ability';
import { roleLabels, type Member, type UpdateMemberInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound, ruleBroken } from '../../lib/http-error.ts';
import { endSessionsOfUser } from '../auth/session-dal.ts';
import { findMember, listMembers as listMemberRows, lockActiveOwnerIds, updateMembership } from './member-dal.ts';

export async function listMembers(deps: AppDeps, actor: Actor): Promise<Member[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Member');
  return listMemberRows(deps.db, actor.firmId);
}

/**
 * Changes a member's role or active flag. An Admin cannot touch an Owner or make one, and the
 * firm's last active Owner can be neither demoted nor deactivated.
 */
export async function updateMember(
  deps: AppDeps,
  actor: Actor,
  memberId: number,
  patch: UpdateMemberInput,
): Promise<Member> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Member');
  const updated = await deps.db.transaction(async (trx) => {
    const member = await findMember(trx, actor.firmId, memberId, { forUpdate: true });
    if (!member) throw notFound('That member');
    ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Member', { ...member }));
    if (patch.role)
      ForbiddenError.from(actor.ability).throwUnlessCan('update', subject('Member', { ...member, role: patch.role }));

    const losesOwner =
      member.role === 'owner' && member.active && ((patch.role && patch.role !== 'owner') || patch.active === false);
    if (losesOwner) {
      const owners = await lockActiveOwnerIds(trx, actor.firmId);
      if (owners.length <= 1) {
        throw ruleBroken(
          `${member.name} is the firm's last active ${roleLabels.owner}. Make someone else ${roleLabels.owner} first.`,
        );
      }
    }
    await updateMembership(trx, actor.firmId, memberId, patch);
    return (await findMember(trx, actor.firmId, memberId))!;
  });
  // Deactivation ends the person's sessions at once rather than at their next request.
  if (patch.active === false) await endSessionsOfUser(deps.db, updated.userId);
  return updated;
}
