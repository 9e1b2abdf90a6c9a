import { describe, expect, it } from 'vitest';
import { subject } from '@casl/ability';
import { defineAbilityFor, type Action, type SubjectName } from './ability.ts';
import { roles, type Role } from './roles.ts';

const firmId = 7;
const otherFirm = firmId + 1;
const ownMemberId = 41;
const ability = (role: Role) => defineAbilityFor({ userId: 1, firmId, role, memberId: ownMemberId });
const member = (role: Role, inFirm = firmId) => subject('Member', { firmId: inFirm, role });

// The role table of README.md's demo sign-ins and roleSummaries (roles.ts): Owner everything; Admin members,
// settings and the firm's records; Stores products, stock, kits and inspections; Engineer their own van and jobs.
describe('defineAbilityFor', () => {
  it('every role may read its own firm and its members, and nothing of another firm', () => {
    for (const role of roles) {
      expect(ability(role).can('read', subject('Firm', { firmId }))).toBe(true);
      expect(ability(role).can('read', member('engineer'))).toBe(true);
      expect(ability(role).can('read', member('engineer', otherFirm))).toBe(false);
      expect(ability(role).can('update', member('engineer', otherFirm))).toBe(false);
    }
  });

  it('only Owner and Admin manage members and invitations', () => {
    expect(roles.filter((r) => ability(r).can('update', 'Member'))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('create', 'Invitation'))).toEqual(['owner', 'admin']);
  });

  it('an Admin can neither change an Owner nor make one; an Owner can do both', () => {
    expect(ability('admin').can('update', member('owner'))).toBe(false);
    expect(ability('admin').can('update', member('engineer'))).toBe(true);
    expect(ability('admin').can('create', subject('Invitation', { firmId, role: 'owner' as const }))).toBe(false);
    expect(ability('admin').can('create', subject('Invitation', { firmId, role: 'stores' as const }))).toBe(true);
    expect(ability('owner').can('update', member('owner'))).toBe(true);
    expect(ability('owner').can('create', subject('Invitation', { firmId, role: 'owner' as const }))).toBe(true);
  });

  it('only Owner and Admin change the firm\u2019s settings, and only their own firm\u2019s', () => {
    expect(roles.filter((r) => ability(r).can('update', subject('Firm', { firmId })))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('update', subject('Firm', { firmId: otherFirm })))).toEqual([]);
  });

  it('only the Owner may delete the firm', () => {
    expect(roles.filter((r) => ability(r).can('delete', subject('Firm', { firmId })))).toEqual(['owner']);
  });
});

/**
 * Per subject and action, the roles allowed on a record of their own firm (tagged with the subject and
 * firmId, no owner or van fields). Records of another firm are refused to every role (checked below).
 */
const firmRecordTable: Record<
  Exclude<SubjectName, 'Firm' | 'Member' | 'Invitation'>,
  Partial<Record<Action, Role[]>>
> = {
  Location: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores'],
    update: ['owner', 'admin', 'stores'],
  },
  ItemKind: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores'],
    update: ['owner', 'admin', 'stores'],
  },
  Kit: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores'],
    update: ['owner', 'admin', 'stores'],
  },
  KitItem: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores'],
    delete: ['owner', 'admin', 'stores'],
  },
  Custody: { read: ['owner', 'admin', 'stores', 'engineer'], update: ['owner', 'admin', 'stores'] },
  Inspection: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores', 'engineer'],
    update: ['owner', 'admin', 'stores'],
  },
  Photo: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores', 'engineer'],
    delete: ['owner', 'admin', 'stores'],
  },
  Reminder: { read: ['owner', 'admin', 'stores'], create: ['owner', 'admin'] },
  ReminderSettings: { read: ['owner', 'admin'], update: ['owner', 'admin'] },
  Product: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores'],
    update: ['owner', 'admin', 'stores'],
  },
  Stock: { read: ['owner', 'admin', 'stores', 'engineer'], create: ['owner', 'admin', 'stores'] },
  StockUse: { create: ['owner', 'admin', 'stores'] },
  ParLevel: { read: ['owner', 'admin', 'stores', 'engineer'], update: ['owner', 'admin', 'stores'] },
  Customer: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores', 'engineer'],
    update: ['owner', 'admin', 'stores'],
  },
  Job: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores', 'engineer'],
    delete: ['owner', 'admin', 'stores'],
  },
  PriceList: { read: ['owner', 'admin', 'stores', 'engineer'], update: ['owner', 'admin'] },
  Quote: { read: ['owner', 'admin', 'stores', 'engineer'], create: ['owner', 'admin', 'engineer'] },
  Invoice: { read: ['owner', 'admin', 'stores', 'engineer'], create: ['owner', 'admin'], update: ['owner', 'admin'] },
  Payment: {
    read: ['owner', 'admin', 'stores', 'engineer'],
    create: ['owner', 'admin', 'stores', 'engineer'],
    update: ['owner', 'admin'],
  },
  PaymentAccount: { read: ['owner', 'admin'], update: ['owner', 'admin'] },
  Billing: { read: ['owner', 'admin'], update: ['owner', 'admin'] },
};

describe('each subject, each role, in their own firm and another', () => {
  for (const [name, actions] of Object.entries(firmRecordTable)) {
    for (const [action, allowed] of Object.entries(actions) as [Action, Role[]][]) {
      it(`${action} ${name}: ${allowed.join(', ')}`, () => {
        const own = subject(name as 'Location', { firmId, kind: 'depot' as const, engineerMemberId: null });
        expect(roles.filter((r) => ability(r).can(action, own))).toEqual(allowed);
        const foreign = subject(name as 'Location', {
          firmId: otherFirm,
          kind: 'depot' as const,
          engineerMemberId: null,
        });
        expect(roles.filter((r) => ability(r).can(action, foreign))).toEqual([]);
      });
    }
  }
});

describe('an engineer\u2019s own van and own jobs', () => {
  const van = (engineerMemberId: number | null, inFirm = firmId) => ({
    firmId: inFirm,
    kind: 'van' as const,
    engineerMemberId,
  });

  it('moves kit (custody) to, from or on from their own van only', () => {
    expect(ability('engineer').can('create', subject('Custody', van(ownMemberId)))).toBe(true);
    expect(ability('engineer').can('create', subject('Custody', van(ownMemberId + 1)))).toBe(false);
    expect(ability('engineer').can('create', subject('Custody', van(null)))).toBe(false);
    expect(
      ability('engineer').can('create', subject('Custody', { firmId, kind: 'depot' as const, engineerMemberId: null })),
    ).toBe(false);
    expect(ability('engineer').can('create', subject('Custody', van(ownMemberId, otherFirm)))).toBe(false);
  });

  it('uses stock by hand from their own van only', () => {
    expect(ability('engineer').can('create', subject('StockUse', van(ownMemberId)))).toBe(true);
    expect(ability('engineer').can('create', subject('StockUse', van(ownMemberId + 1)))).toBe(false);
    expect(
      ability('engineer').can(
        'create',
        subject('StockUse', { firmId, kind: 'depot' as const, engineerMemberId: null }),
      ),
    ).toBe(false);
  });

  it('updates their own jobs only; stores, admin and owner update any job of the firm', () => {
    const job = (engineerMemberId: number | null, inFirm = firmId) =>
      subject('Job', { firmId: inFirm, engineerMemberId });
    expect(ability('engineer').can('update', job(ownMemberId))).toBe(true);
    expect(ability('engineer').can('update', job(ownMemberId + 1))).toBe(false);
    expect(ability('engineer').can('update', job(null))).toBe(false);
    expect(ability('engineer').can('update', job(ownMemberId, otherFirm))).toBe(false);
    expect(roles.filter((r) => ability(r).can('update', job(ownMemberId + 1)))).toEqual(['owner', 'admin', 'stores']);
  });

  it('an engineer with no membership id (not yet loaded) gets no own-van or own-job rights', () => {
    const anonymous = defineAbilityFor({ userId: 1, firmId, role: 'engineer' });
    expect(anonymous.can('create', subject('Custody', van(ownMemberId)))).toBe(false);
    expect(anonymous.can('update', subject('Job', { firmId, engineerMemberId: ownMemberId }))).toBe(false);
  });
});

// DEVELOPERS.md, Product rules (Roles) and issue 15: engineers may show the pay QR, not refund; the payment
// account and the firm's own subscription are the Owner's.
describe('payments and billing', () => {
  it('every role may start a payment; only Owner and Admin refund', () => {
    expect(roles.filter((r) => ability(r).can('create', 'Payment'))).toEqual([...roles]);
    expect(roles.filter((r) => ability(r).can('update', 'Payment'))).toEqual(['owner', 'admin']);
  });
  it('the payment account and the subscription are firm settings: Owner and Admin', () => {
    expect(roles.filter((r) => ability(r).can('update', 'PaymentAccount'))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('read', 'Billing'))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('update', 'Billing'))).toEqual(['owner', 'admin']);
  });
  it('money: everyone reads; prices and invoices are the Owner and Admin; engineers make and take quotes', () => {
    for (const s of ['PriceList', 'Quote', 'Invoice'] as const)
      expect(roles.filter((r) => ability(r).can('read', s))).toEqual([...roles]);
    expect(roles.filter((r) => ability(r).can('update', 'PriceList'))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('create', 'Invoice'))).toEqual(['owner', 'admin']);
    expect(roles.filter((r) => ability(r).can('update', 'Quote'))).toEqual(['owner', 'admin', 'engineer']);
  });
});
