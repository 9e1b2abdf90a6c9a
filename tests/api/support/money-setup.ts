import { completionCodes } from '@heatfleet/domain';
import type { Client, TestApp } from './test-app.ts';
import { signIn } from './test-app.ts';
import { seedFirm, type SeededFirm } from './seed-firm.ts';

/** A reason for everything the completion guard could ask about (visit-completion.test.ts tests the guard). */
export const allReasons = {
  confirmations: completionCodes.map((code) => ({ code, reason: 'Not the point of this test' })),
};

export const VAT_NUMBER = 'GB123456789';

export interface MoneyFirm {
  firm: SeededFirm;
  owner: Client;
  engineer: Client;
  prices: { visitId: number; chemicalId: number; extraId: number };
}

/**
 * A seeded firm with money settings (VAT registered at 20%, or not) and a price list: a full clean at
 * £150 + £15 a radiator, the seeded cleaner at £29.99 a pack, a filter fitted at £45.
 */
export async function setUpMoneyFirm(
  t: TestApp,
  label: string,
  opts: { vatRegistered?: boolean } = {},
): Promise<MoneyFirm> {
  const firm = await seedFirm(t.deps.db, label);
  const owner = await signIn(t.app, firm.people.owner.email);
  const engineer = await signIn(t.app, firm.people.engineer.email);
  const vatRegistered = opts.vatRegistered ?? true;
  const settings = await owner.put('/api/money/settings', {
    vatRegistered,
    vatNumber: vatRegistered ? VAT_NUMBER : null,
    vatRateBp: 2000,
    paymentTermsDays: 14,
    quoteValidityDays: 30,
    firstReminderDays: 7,
    secondReminderDays: 21,
  });
  if (settings.status !== 200) throw new Error(`settings: ${settings.status} ${JSON.stringify(settings.body)}`);
  const add = async (body: unknown) => {
    const res = await owner.post('/api/money/price-items', body);
    if (res.status !== 201) throw new Error(`price: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.id as number;
  };
  const visitId = await add({
    kind: 'visit',
    name: 'Full clean',
    visitKind: 'full_clean',
    pricing: 'per_radiator',
    basePence: 15_000,
    perRadiatorPence: 1_500,
  });
  const chemicalId = await add({
    kind: 'chemical',
    name: 'Cleaner, 1 L',
    productId: firm.product.id,
    unitPence: 2_999,
  });
  const extraId = await add({ kind: 'extra', name: 'Filter fitted', unitPence: 4_500 });
  return { firm, owner, engineer, prices: { visitId, chemicalId, extraId } };
}
