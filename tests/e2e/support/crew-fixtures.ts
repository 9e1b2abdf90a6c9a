import type { Depot, Van } from '@heatfleet/domain';
import { inviteMember, signUpFirm, type Firm, type Person } from './firm-fixtures';
import { createVan, mainDepot } from './fleet-fixtures';

/** A fresh firm with an engineer driving "Van 1", and a stores person when asked for. */
export interface Crew {
  firm: Firm;
  owner: Person;
  engineer: Person;
  stores: Person | null;
  van: Van;
  depot: Depot;
}

export async function firmWithCrew(
  baseURL: string,
  options: { stores?: boolean; motDueOn?: string } = {},
): Promise<Crew> {
  const firm = await signUpFirm(baseURL);
  // One invitation at a time, as an office sends them (the API retries two at once whole: invitation-service.ts).
  const engineer = await inviteMember(firm, 'engineer', 'Ellis Brannock');
  const stores = options.stores ? await inviteMember(firm, 'stores', 'Wren Tolley') : null;
  // An invented registration; the firm is new, so no other van has it.
  const van = await createVan(firm.owner.session, {
    name: 'Van 1',
    registration: 'HF21 BRK',
    engineerMemberId: engineer.memberId,
    motDueOn: options.motDueOn ?? null,
  });
  return { firm, owner: firm.owner, engineer, stores, van, depot: await mainDepot(firm.owner.session) };
}
