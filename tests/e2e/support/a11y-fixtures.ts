import type { Role } from '@heatfleet/domain';
import { callApi } from './api-session';
import { firmWithCrew } from './crew-fixtures';
import { runId } from './e2e-helpers';
import { inviteMember, type Person } from './firm-fixtures';
import { addKitItem, createKit, itemKindNamed } from './fleet-fixtures';
import { addCustomer, addSite, bookJob } from './job-fixtures';
import { createProduct, isoDaysFromNow, receiveStock, transferStock } from './stock-fixtures';

/**
 * A firm with something on every page, for the accessibility sweep: one person per role, a van with stock on it and
 * a pack used (so Home draws its chart), a kit with an item, a customer with a site and a booked job.
 */
export interface FurnishedFirm {
  people: Record<Role, Person>;
  ids: { van: number; kit: number; item: number; product: number; job: number; site: number };
}

export async function furnishedFirm(baseURL: string): Promise<FurnishedFirm> {
  const crew = await firmWithCrew(baseURL, { stores: true });
  const admin = await inviteMember(crew.firm, 'admin', 'Ines Marrable');
  const session = crew.owner.session;
  const id = runId().toUpperCase();
  const product = (kind: 'cleaner' | 'inhibitor') =>
    createProduct(session, {
      name: `Sweep ${kind} ${id}`,
      kind,
      packSize: 1,
      packUnit: 'l',
      doseLitresPer100L: 1,
      radiatorsPerPack: 10,
      shelfLifeMonths: 24,
      ...(kind === 'inhibitor'
        ? { targetMin: 1, targetMax: 1.5, targetUnit: '% v/v', testMethod: 'Refractometer' }
        : {}),
    });
  const products = [await product('cleaner'), await product('inhibitor')];
  const lines = products.map((p) => ({ productId: p.id, quantity: 4 }));
  await receiveStock(session, {
    locationId: crew.depot.id,
    reference: `Sweep ${id}`,
    lines: lines.map((l) => ({ ...l, lotNumber: `S${id.slice(-6)}`, expiresOn: isoDaysFromNow(400) })),
  });
  await transferStock(session, { fromLocationId: crew.depot.id, toLocationId: crew.van.id, lines });
  for (const p of products)
    await callApi(crew.engineer.session, 'post', '/api/stock/usages', {
      data: { locationId: crew.van.id, productId: p.id, quantity: 1, reason: 'Cleaning job' },
      status: 201,
    });
  const kit = await createKit(session, 'Rig 1');
  const item = await addKitItem(session, {
    assetTag: `SW-${id.slice(-5)}`,
    kindId: (await itemKindNamed(session, 'Agitator head')).id,
    kitId: kit.id,
  });
  const customer = await addCustomer(session, { name: 'Hedda Quarrington', email: 'hedda@customer.example' });
  const site = await addSite(session, customer.id, { address: '2 Millrace Row, Brackenford BF3 1QT' });
  const booked = await bookJob(session, {
    siteId: site.id,
    scheduledOn: isoDaysFromNow(1),
    engineerMemberId: crew.engineer.memberId,
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [
        { room: 'Lounge', panel: 'double' },
        { room: 'Hall', panel: 'single' },
      ],
      pipeRuns: [],
    },
    productIds: products.map((p) => p.id),
  });
  return {
    people: { owner: crew.owner, admin, stores: crew.stores!, engineer: crew.engineer },
    ids: {
      van: crew.van.id,
      kit: kit.id,
      item: item.id,
      product: products[0]!.id,
      job: booked.job.id,
      site: site.id,
    },
  };
}
