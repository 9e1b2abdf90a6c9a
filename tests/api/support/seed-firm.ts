import type { Knex } from 'knex';
import { seedMoney, type SeededMoney } from './seed-money.ts';
import { seedPayment } from './seed-payment.ts';
import { roles, type Role } from '@heatfleet/domain';
import { hashPassword } from '@heatfleet/api/modules/auth/password.ts';
import { createToken } from '@heatfleet/api/lib/tokens.ts';
import { setUpNewFirm } from '@heatfleet/api/modules/firms/firm-dal.ts';
import { TEST_PASSWORD, uniqueEmail } from './test-app.ts';

export interface SeededFirm {
  firmId: number;
  firmName: string;
  /** One signed-in-able person per role. */
  people: Record<Role, { email: string; userId: number; memberId: number }>;
  /** An extra engineer to act upon. */
  target: { email: string; userId: number; memberId: number };
  invitation: { id: number; email: string; token: string };
  emailId: number;
  depotId: number;
  van: { id: number; registration: string };
  /** A second van with no engineer, to move kit to. */
  spareVanId: number;
  kit: { id: number; name: string; itemIds: number[] };
  looseItemId: number;
  kindId: number;
  photoId: number;
  product: { id: number; name: string; batchId: number; lotNumber: string };
  movementId: number;
  customerId: number;
  siteId: number;
  jobId: number;
  /** Price, invoice, credit note and quote (support/seed-money.ts). */
  money: SeededMoney;
  /** A pending card payment against the seeded invoice (support/seed-payment.ts). */
  paymentId: number;
  /** Strings that belong to this firm only: none may appear in another firm's answers. */
  sentinels: string[];
}

let hash: Promise<string> | undefined;

/** One of every record a firm has, written straight to the database (faster than the API). */
export async function seedFirm(db: Knex, label: string): Promise<SeededFirm> {
  hash ??= hashPassword(TEST_PASSWORD);
  const passwordHash = await hash;
  const firmName = `Seeded ${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  return db.transaction(async (trx) => {
    const [firmId] = (await trx('firms').insert({ name: firmName, time_zone: 'Europe/London' })) as number[];
    const addPerson = async (role: Role, name: string) => {
      const email = uniqueEmail(`${label}-${name}`);
      const [userId] = (await trx('users').insert({
        email,
        name: `${label} ${name}`,
        password_hash: passwordHash,
      })) as number[];
      const [memberId] = (await trx('memberships').insert({
        firm_id: firmId,
        user_id: userId,
        role,
        active: true,
      })) as number[];
      return { email, userId: userId!, memberId: memberId! };
    };
    const people = {} as SeededFirm['people'];
    for (const role of roles) people[role] = await addPerson(role, role);
    const target = await addPerson('engineer', 'target');
    const { token, tokenHash } = createToken();
    const inviteEmail = uniqueEmail(`${label}-invitee`);
    const [invitationId] = (await trx('invitations').insert({
      firm_id: firmId,
      email: inviteEmail,
      role: 'engineer',
      token_hash: tokenHash,
      invited_by_user_id: people.owner.userId,
      expires_at: new Date(Date.now() + 7 * 86_400_000),
    })) as number[];
    const [emailId] = (await trx('emails').insert({
      firm_id: firmId,
      to_address: inviteEmail,
      subject: `Invitation to ${firmName}`,
      text_body: 'seeded',
      purpose: 'invitation',
      sent_at: new Date(),
    })) as number[];
    await setUpNewFirm(trx, firmId!);
    const depotId = ((await trx('locations').where({ firm_id: firmId, kind: 'depot' }).first('id')) as { id: number })
      .id;
    const suffix = Math.random().toString(36).slice(2, 6).toUpperCase();
    const registration = `SD${String(firmId).padStart(2, '0').slice(-2)} ${suffix.slice(0, 3)}`;
    const [vanId] = (await trx('locations').insert({
      firm_id: firmId,
      kind: 'van',
      name: `${label} van`,
      registration,
      engineer_member_id: people.engineer.memberId,
      mot_due_on: '2027-01-10',
      service_due_on: '2027-03-01',
    })) as number[];
    const [spareVanId] = (await trx('locations').insert({
      firm_id: firmId,
      kind: 'van',
      name: `${label} spare van`,
      registration: `SP${suffix}1`,
    })) as number[];
    const kindId = (
      (await trx('item_kinds').where({ firm_id: firmId, name: 'Hose set' }).first('id')) as { id: number }
    ).id;
    const kitName = `${label} rig ${suffix}`;
    const [kitId] = (await trx('kits').insert({ firm_id: firmId, name: kitName })) as number[];
    const itemIds: number[] = [];
    for (const part of ['A', 'B']) {
      const [itemId] = (await trx('kit_items').insert({
        firm_id: firmId,
        kit_id: kitId,
        kind_id: kindId,
        asset_tag: `T${suffix}${firmId}${part}`,
        location_id: depotId,
        in_service_since: '2026-11-01',
      })) as number[];
      itemIds.push(itemId!);
    }
    const [looseItemId] = (await trx('kit_items').insert({
      firm_id: firmId,
      kind_id: kindId,
      asset_tag: `L${suffix}${firmId}`,
      location_id: depotId,
      in_service_since: '2026-11-01',
    })) as number[];
    await trx('custody_events').insert({
      firm_id: firmId,
      item_id: looseItemId,
      action: 'check_in',
      to_location_id: depotId,
      by_user_id: people.stores.userId,
      condition: 'in_service',
    });
    await trx('inspections').insert({
      firm_id: firmId,
      item_id: looseItemId,
      result: 'passed',
      by_user_id: people.stores.userId,
      inspected_on: '2026-11-20',
      notes: `${label} inspected`,
    });
    const [photoId] = (await trx('photos').insert({
      firm_id: firmId,
      item_id: looseItemId,
      object_key: `firms/${firmId}/photos/seeded-${suffix}-${firmId}.png`,
      content_type: 'image/png',
      byte_size: 1,
      uploaded_by_user_id: people.stores.userId,
    })) as number[];
    const productName = `${label} cleaner ${suffix}`;
    const [productId] = (await trx('products').insert({
      firm_id: firmId,
      name: productName,
      kind: 'cleaner',
      pack_size_ml: 1000,
      dose_litres_per_100l: 1,
    })) as number[];
    const lotNumber = `LOT${suffix}${firmId}`;
    const [batchId] = (await trx('product_batches').insert({
      firm_id: firmId,
      product_id: productId,
      lot_number: lotNumber,
      expires_on: '2030-01-31',
    })) as number[];
    await trx('stock_balances').insert([
      { firm_id: firmId, location_id: depotId, batch_id: batchId, product_id: productId, quantity: 10 },
      { firm_id: firmId, location_id: vanId, batch_id: batchId, product_id: productId, quantity: 2 },
    ]);
    const [movementId] = (await trx('stock_movements').insert([
      {
        firm_id: firmId,
        group_id: `seed-${suffix}-${firmId}`,
        kind: 'received',
        location_id: depotId,
        product_id: productId,
        batch_id: batchId,
        quantity_delta: 12,
        by_user_id: people.stores.userId,
        reference: `DEL-${suffix}`,
      },
    ])) as number[];
    await trx('stock_movements').insert([
      {
        firm_id: firmId,
        group_id: `seed2-${suffix}-${firmId}`,
        kind: 'transfer_out',
        location_id: depotId,
        product_id: productId,
        batch_id: batchId,
        quantity_delta: -2,
        by_user_id: people.stores.userId,
      },
      {
        firm_id: firmId,
        group_id: `seed2-${suffix}-${firmId}`,
        kind: 'transfer_in',
        location_id: vanId,
        product_id: productId,
        batch_id: batchId,
        quantity_delta: 2,
        by_user_id: people.stores.userId,
      },
    ]);
    await trx('par_levels').insert([
      { firm_id: firmId, location_id: vanId, product_id: productId, minimum: 3, target: 5 },
      { firm_id: firmId, location_id: depotId, product_id: productId, minimum: 20, target: 30 },
    ]);
    const customerName = `${label} customer ${suffix}`;
    const [customerId] = (await trx('customers').insert({
      firm_id: firmId,
      name: customerName,
      email: `${label.toLowerCase()}-${suffix.toLowerCase()}@customer.example`,
    })) as number[];
    const siteAddress = `${suffix} Quarry Lane, Brackenford`;
    const [siteId] = (await trx('sites').insert({
      firm_id: firmId,
      customer_id: customerId,
      address: siteAddress,
    })) as number[];
    const survey = {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [{ room: 'Hall', panel: 'single' }],
      pipeRuns: [],
    };
    const [jobId] = (await trx('jobs').insert({
      firm_id: firmId,
      site_id: siteId,
      engineer_member_id: people.engineer.memberId,
      van_location_id: vanId,
      scheduled_on: '2026-12-10',
      survey: JSON.stringify(survey),
    })) as number[];
    await trx('job_products').insert({ firm_id: firmId, job_id: jobId, product_id: productId });
    const sentinels = [
      customerName,
      siteAddress,
      firmName,
      inviteEmail,
      target.email,
      ...roles.map((r) => people[r].email),
      registration,
      kitName,
      `T${suffix}${firmId}A`,
      `L${suffix}${firmId}`,
      productName,
      lotNumber,
    ];
    const money = await seedMoney(trx, {
      firmId: firmId!,
      firmName,
      siteId: siteId!,
      customerId: customerId!,
      customerName,
      jobId: jobId!,
      userId: people.owner.userId,
    });
    return {
      firmId: firmId!,
      firmName,
      people,
      target,
      invitation: { id: invitationId!, email: inviteEmail, token },
      emailId: emailId!,
      sentinels,
      depotId,
      van: { id: vanId!, registration },
      spareVanId: spareVanId!,
      kit: { id: kitId!, name: kitName, itemIds },
      looseItemId: looseItemId!,
      kindId,
      photoId: photoId!,
      product: { id: productId!, name: productName, batchId: batchId!, lotNumber },
      movementId: movementId!,
      customerId: customerId!,
      siteId: siteId!,
      jobId: jobId!,
      money,
      paymentId: await seedPayment(trx, firmId!, money.invoiceId),
    };
  });
}

/** Every row of every table that has firm_id, for this firm: the isolation test compares before and after. */
export async function snapshotFirm(db: Knex, firmId: number): Promise<Record<string, unknown[]>> {
  const tables = await tenantTables(db);
  const snapshot: Record<string, unknown[]> = { firms: await db('firms').where({ id: firmId }) };
  // Not every table has an id column (balances are keyed by place and batch): sort the rows themselves.
  for (const table of tables) {
    snapshot[table] = ((await db(table).where({ firm_id: firmId })) as unknown[]).map((r) => JSON.stringify(r)).sort();
  }
  return snapshot;
}

export async function tenantTables(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw(
    "SELECT table_name AS name FROM information_schema.columns WHERE table_schema = DATABASE() AND column_name = 'firm_id' ORDER BY table_name",
  )) as [{ name: string }[]];
  return rows.map((r) => r.name);
}

export async function allTables(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw(
    'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()',
  )) as [{ name: string }[]];
  return rows.map((r) => r.name);
}
