import { AbilityBuilder, createMongoAbility, type ForcedSubject, type MongoAbility } from '@casl/ability';
import type { Role } from './roles.ts';

export type Action = 'manage' | 'create' | 'read' | 'update' | 'delete';

/** The fields rules look at, per subject; tag a record with `subject('Member', row)`. */
export interface FirmRecord {
  firmId: number;
}
export interface MemberRecord {
  firmId: number;
  role: Role;
}
export interface InvitationRecord {
  firmId: number;
  role: Role;
}

/** A van or depot; engineerMemberId is the van's engineer. */
export interface LocationRecord {
  firmId: number;
  kind: 'depot' | 'van';
  engineerMemberId: number | null;
}

export type SubjectName =
  | 'Firm'
  | 'Member'
  | 'Invitation'
  | 'Location'
  | 'ItemKind'
  | 'Kit'
  | 'KitItem'
  | 'Custody'
  | 'Inspection'
  | 'Photo'
  | 'Reminder'
  | 'ReminderSettings'
  | 'Product'
  | 'Stock'
  | 'StockUse'
  | 'ParLevel'
  | 'Customer'
  | 'Job'
  | 'Payment'
  | 'PaymentAccount'
  | 'Billing'
  | 'PriceList'
  | 'Quote'
  | 'Invoice';
export type AppSubjects =
  | SubjectName
  | 'all'
  | (FirmRecord & ForcedSubject<'Firm'>)
  | (MemberRecord & ForcedSubject<'Member'>)
  | (InvitationRecord & ForcedSubject<'Invitation'>)
  | (LocationRecord & ForcedSubject<'Location'>)
  | (LocationRecord & ForcedSubject<'Custody'>)
  | (LocationRecord & ForcedSubject<'StockUse'>)
  | ({ firmId: number; engineerMemberId: number | null } & ForcedSubject<'Job'>);
export type AppAbility = MongoAbility<[Action, AppSubjects]>;

export interface AbilityInput {
  userId: number;
  firmId: number;
  role: Role;
  /** The member's own membership id, for "their own van" rules. */
  memberId?: number;
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
  // Everyone may look up where any kit is, and see the firm's vans and depots.
  can(
    'read',
    [
      'Location',
      'ItemKind',
      'Kit',
      'KitItem',
      'Custody',
      'Inspection',
      'Photo',
      'Product',
      'Stock',
      'ParLevel',
      'Customer',
      'Job',
    ],
    inFirm,
  );
  // Anyone may show a customer the pay QR for an invoice (a checkout for what is owed); refunds are the office's.
  can(['read', 'create'], 'Payment', inFirm);
  // Money (issue 15): everyone sees prices, quotes and invoices; the office sets prices and invoices.
  can('read', ['PriceList', 'Quote', 'Invoice'], inFirm);

  switch (member.role) {
    case 'owner':
      can('manage', 'all', inFirm);
      break;
    case 'admin':
      can('update', 'Firm', inFirm);
      can('manage', 'Invitation', inFirm);
      can('update', 'Member', inFirm);
      // An Admin neither makes, changes nor removes an Owner.
      cannot('update', 'Member', { role: 'owner' });
      cannot('create', 'Invitation', { role: 'owner' });
      can(
        'manage',
        [
          'Location',
          'ItemKind',
          'Kit',
          'KitItem',
          'Custody',
          'Inspection',
          'Photo',
          'Reminder',
          'ReminderSettings',
          'Product',
          'Stock',
          'StockUse',
          'ParLevel',
          'Customer',
          'Job',
          'Payment',
          'PriceList',
          'Quote',
          'Invoice',
        ],
        inFirm,
      );
      // The firm's payment account and its Heatfleet subscription are firm settings (DEVELOPERS.md, Product rules).
      can('manage', ['PaymentAccount', 'Billing'], inFirm);
      break;
    case 'stores':
      can(
        'manage',
        [
          'Location',
          'ItemKind',
          'Kit',
          'KitItem',
          'Custody',
          'Inspection',
          'Photo',
          'Product',
          'Stock',
          'StockUse',
          'ParLevel',
          'Customer',
          'Job',
        ],
        inFirm,
      );
      can('read', 'Reminder', inFirm);
      break;
    case 'engineer':
      // Their own van only: check kit out to it, back in from it, or on to another van from it.
      if (member.memberId !== undefined) {
        can('create', 'Custody', { firmId: member.firmId, kind: 'van', engineerMemberId: member.memberId });
        // Stock used by hand (a job's chemicals come off with the job) from their own van only.
        can('create', 'StockUse', { firmId: member.firmId, kind: 'van', engineerMemberId: member.memberId });
      }
      can('create', ['Inspection', 'Photo', 'Customer', 'Job'], inFirm);
      // A quote from the survey, sent or accepted on the phone with the customer; never prices or invoices.
      can(['create', 'update'], 'Quote', inFirm);
      if (member.memberId !== undefined)
        can('update', 'Job', { firmId: member.firmId, engineerMemberId: member.memberId });
      break;
  }
  return build();
}
