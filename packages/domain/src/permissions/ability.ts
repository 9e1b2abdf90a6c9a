import { AbilityBuilder, createMongoAbility, type ForcedSubject, type MongoAbility } from '@casl/ability';
import type { Role } from './roles.ts';

export type Action = 'manage' | 'create' | 'read' | 'update' | 'delete';

/** The fields rules look at, per subject; tag a record with `subject('Member', row)`. */
export interface FirmRecord { firmId: number }
export interface MemberRecord { firmId: number; role: Role }
export interface InvitationRecord { firmId: number; role: Role }

export type SubjectName = 'Firm' | 'Member' | 'Invitation';
export type AppSubjects =
  | SubjectName
  | 'all'
  | (FirmRecord & ForcedSubject<'Firm'>)
  | (MemberRecord & ForcedSubject<'Member'>)
  | (InvitationRecord & ForcedSubject<'Invitation'>);
export type AppAbility = MongoAbility<[Action, AppSubjects]>;

export interface AbilityInput {
  userId: number;
  firmId: number;
  role: Role;
}

/**
 * The one rule set of Heatfleet. The API enforces it in its services; the web client
 * uses it only to hide what a member may not do.
 */
export function defineAbilityFor(member: AbilityInput): AppAbility {
  const { can, cannot, build } = new AbilityBuilder<AppAbility>(createMongoAbility);
  const inFirm = { firmId: member.firmId };

  can('read', 'Firm', inFirm);
  // Every member may see who else is in the firm (names and roles), e.g. to hand a kit over.
  can('read', 'Member', inFirm);

  switch (member.role) {
    case 'owner':
      can('manage', 'Firm', inFirm);
      can('manage', 'Member', inFirm);
      can('manage', 'Invitation', inFirm);
      break;
    case 'admin':
      can('update', 'Firm', inFirm);
      can('manage', 'Invitation', inFirm);
      can('update', 'Member', inFirm);
      // An Admin neither makes, changes nor removes an Owner.
      cannot('update', 'Member', { role: 'owner' });
      cannot('create', 'Invitation', { role: 'owner' });
      break;
    case 'stores':
    case 'engineer':
      break;
  }
  return build();
}
