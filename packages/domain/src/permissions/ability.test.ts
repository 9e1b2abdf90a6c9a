import { describe, expect, it } from 'vitest';
import { subject } from '@casl/ability';
import { defineAbilityFor } from './ability.ts';
import { roles, type Role } from './roles.ts';

const firmId = 7;
const ability = (role: Role) => defineAbilityFor({ userId: 1, firmId, role });
const member = (role: Role, inFirm = firmId) => subject('Member', { firmId: inFirm, role });

// The role table of the product brief (PRODUCT.md, "Who uses it").
describe('defineAbilityFor', () => {
  it('every role may read its own firm and its members, and nothing of another firm', () => {
    for (const role of roles) {
      expect(ability(role).can('read', subject('Firm', { firmId }))).toBe(true);
      expect(ability(role).can('read', member('engineer'))).toBe(true);
      expect(ability(role).can('read', member('engineer', firmId + 1))).toBe(false);
      expect(ability(role).can('update', member('engineer', firmId + 1))).toBe(false);
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
    expect(roles.filter((r) => ability(r).can('update', subject('Firm', { firmId: firmId + 1 })))).toEqual([]);
  });

  it('only the Owner may delete the firm', () => {
    expect(roles.filter((r) => ability(r).can('delete', subject('Firm', { firmId })))).toEqual(['owner']);
  });
});
