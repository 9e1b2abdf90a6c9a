import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Pool } from 'mysql2/promise';
import { addDays, calendarDateIn, DEFAULT_TIME_ZONE, defaultItemKinds } from '@heatfleet/domain';
import { setUpNewFirm } from '@heatfleet/api/modules/firms/firm-dal.ts';
import { BulkWriter, insertReturningIds } from './bulk-insert.ts';

/** One invented firm to generate; the three bench firms differ only in ledger length, kit and job counts. */
export interface FirmSpec {
  key: 'large' | 'medium' | 'small';
  name: string;
  /** The e-mail domain of its members (reserved .example names). */
  domain: string;
  vans: number;
  products: number;
  movements: number;
  kitItems: number;
  jobs: number;
}

export interface GeneratedFirm {
  key: FirmSpec['key'];
  firmId: number;
  name: string;
  ownerEmail: string;
  engineerEmail: string;
  movements: number;
  custodyEvents: number;
  kitItems: number;
  jobs: number;
  vans: number;
  products: number;
  seconds: number;
}

// Invented names only: syllables put together, matching no one in particular.
const firstNames = [
  'Ansel',
  'Briony',
  'Cadoc',
  'Delyth',
  'Emrys',
  'Fenna',
  'Gethin',
  'Hollis',
  'Idris',
  'Jessamy',
  'Kester',
  'Linnet',
  'Morwen',
  'Nerys',
  'Orrin',
  'Peregrine',
  'Quilla',
  'Rhodri',
  'Sabeth',
  'Tamsin',
  'Ulric',
  'Verity',
  'Wystan',
  'Yestin',
  'Zelda',
];
const lastNames = [
  'Ashcombe',
  'Brackwater',
  'Coldharbour',
  'Dunmere',
  'Elderby',
  'Fallowfield',
  'Greythorn',
  'Hartwell',
  'Ivybridge',
  'Juniper',
  'Kettleby',
  'Larkspur',
  'Millbeck',
  'Nettlecombe',
  'Oakhollow',
  'Pennyfold',
  'Quarrington',
  'Rushmere',
  'Saltmarsh',
  'Thornbury',
];
const streets = [
  'Weir Lane',
  'Kiln Row',
  'Sluice Street',
  'Tannery Walk',
  'Orchard Rise',
  'Furnace Close',
  'Ropewalk',
  'Lock Cottages',
  'Quarry Hill',
  'Ferry Road',
];
const productKinds = ['cleaner', 'inhibitor', 'descaler', 'leak_sealer', 'neutraliser'] as const;

/** A small, seeded generator (mulberry32), so every run builds the same firm. */
function randomSource(seed: number) {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
  return { next, int: (n: number) => Math.floor(next() * n) };
}

const pad = (n: number, width: number) => String(n).padStart(width, '0');
const dayMs = 86_400_000;

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

/** Progress on one line while it works (a new line each time when not on a terminal). */
function progress(label: string, done: number, total: number, began: number): void {
  const line = `  ${label} ${done.toLocaleString('en-GB')} / ${total.toLocaleString('en-GB')} (${((Date.now() - began) / 1000).toFixed(1)} s)`;
  if (process.stdout.isTTY) process.stdout.write(`\r${line}`);
  else if (done === total || done % (total >= 500_000 ? 100_000 : 25_000) === 0) say(line);
  if (process.stdout.isTTY && done === total) process.stdout.write('\n');
}

export async function generateFirm(
  db: Knex,
  pool: Pool,
  spec: FirmSpec,
  passwordHash: string,
  now: Date,
  seed: number,
): Promise<GeneratedFirm> {
  const began = Date.now();
  const rnd = randomSource(seed);
  const today = calendarDateIn(now, DEFAULT_TIME_ZONE);
  const yearAgo = now.getTime() - 365 * dayMs;
  say(
    `${spec.name}: ${spec.vans} vans, ${spec.products} products, ${spec.movements.toLocaleString('en-GB')} movements, ${spec.kitItems.toLocaleString('en-GB')} kit items, ${spec.jobs.toLocaleString('en-GB')} jobs`,
  );

  const firmId = await db.transaction(async (trx) => {
    const [id] = await trx('firms').insert({
      name: spec.name,
      address: `1 ${streets[seed % streets.length]}, Bench Town BT1 1AA`,
      time_zone: DEFAULT_TIME_ZONE,
    });
    await setUpNewFirm(trx, id as number);
    return id as number;
  });
  const depotId = ((await db('locations').where({ firm_id: firmId, kind: 'depot' }).first('id')) as { id: number }).id;

  // People: an owner, an admin, a storesperson and one engineer per van, all with the same known password.
  const personName = (n: number) =>
    `${firstNames[n % firstNames.length]} ${lastNames[Math.floor(n / firstNames.length) % lastNames.length]}`;
  const people = [
    { email: `owner@${spec.domain}`, role: 'owner' },
    { email: `admin@${spec.domain}`, role: 'admin' },
    { email: `stores@${spec.domain}`, role: 'stores' },
    ...Array.from({ length: spec.vans }, (_, v) => ({
      email: `engineer-${pad(v + 1, 3)}@${spec.domain}`,
      role: 'engineer',
    })),
  ];
  const userIds = await insertReturningIds(
    pool,
    'users',
    ['email', 'name', 'password_hash'],
    people.map((p, n) => [p.email, personName(n + seed), passwordHash]),
  );
  const memberIds = await insertReturningIds(
    pool,
    'memberships',
    ['firm_id', 'user_id', 'role', 'active'],
    people.map((p, n) => [firmId, userIds[n], p.role, 1]),
  );
  const storesUser = userIds[2]!;
  const engineerUser = (v: number) => userIds[3 + v]!;

  const vanIds = await insertReturningIds(
    pool,
    'locations',
    ['firm_id', 'kind', 'name', 'registration', 'engineer_member_id', 'mot_due_on', 'service_due_on'],
    Array.from({ length: spec.vans }, (_, v) => [
      firmId,
      'van',
      `Van ${pad(v + 1, 3)}`,
      `BV${pad(v + 1, 3)} ${String.fromCharCode(65 + (seed % 26))}QR`,
      memberIds[3 + v],
      addDays(today, 5 + rnd.int(360)),
      addDays(today, -10 + rnd.int(300)),
    ]),
  );

  // Products, each with three lots: one already expired, one expiring within three months, one long-dated.
  const productIds = await insertReturningIds(
    pool,
    'products',
    [
      'firm_id',
      'name',
      'kind',
      'pack_size_ml',
      'dose_litres_per_100l',
      'radiators_per_pack',
      'shelf_life_months',
      'hazard_notes',
    ],
    Array.from({ length: spec.products }, (_, p) => {
      const kind = productKinds[p % productKinds.length]!;
      return [
        firmId,
        `BX ${kind.replace('_', ' ')} ${pad(p + 1, 3)}`,
        kind,
        p % 2 === 0 ? 1000 : 500,
        1,
        10,
        36,
        'Wear gloves and eye protection.',
      ];
    }),
  );
  const lotDays = [-30, 60, 540];
  const batchIds = await insertReturningIds(
    pool,
    'product_batches',
    ['firm_id', 'product_id', 'lot_number', 'expires_on'],
    productIds.flatMap((productId, p) =>
      lotDays.map((d, n) => [firmId, productId, `BX${pad(p + 1, 3)}-${n + 1}`, addDays(today, d + (p % 7))]),
    ),
  );
  const batchesOf = (p: number) => [batchIds[p * 3]!, batchIds[p * 3 + 1]!, batchIds[p * 3 + 2]!];

  // Par levels: every product on every van, and at the depot.
  const pars = new BulkWriter(pool, 'par_levels', ['firm_id', 'location_id', 'product_id', 'minimum', 'target']);
  for (const productId of productIds) {
    for (const vanId of vanIds) await pars.add([firmId, vanId, productId, 1, 3]);
    await pars.add([firmId, depotId, productId, 40, 160]);
  }
  await pars.close();

  // The ledger, in time order, with every balance kept in memory so none goes below zero.
  const balances = new Map<string, { location: number; batch: number; product: number; quantity: number }>();
  const balanceOf = (location: number, batch: number) => balances.get(`${location}:${batch}`)?.quantity ?? 0;
  const move = (location: number, batch: number, product: number, delta: number) => {
    const key = `${location}:${batch}`;
    const b = balances.get(key) ?? { location, batch, product, quantity: 0 };
    b.quantity += delta;
    if (b.quantity < 0) throw new Error(`Generator bug: balance ${key} went below zero.`);
    balances.set(key, b);
  };
  const movementsBegan = Date.now();
  const ledger = new BulkWriter(
    pool,
    'stock_movements',
    [
      'firm_id',
      'group_id',
      'kind',
      'location_id',
      'product_id',
      'batch_id',
      'quantity_delta',
      'reason',
      'reference',
      'by_user_id',
      'created_at',
    ],
    (n) => progress('movements', n, spec.movements, movementsBegan),
  );
  let written = 0;
  let receipt = 0;
  const span = now.getTime() - 3_600_000 - yearAgo;
  const row = async (
    kind: string,
    group: string,
    location: number,
    p: number,
    batch: number,
    delta: number,
    reason: string | null,
    reference: string | null,
    by: number,
  ) => {
    move(location, batch, productIds[p]!, delta);
    const at = new Date(yearAgo + Math.floor((written / spec.movements) * span));
    written += 1;
    await ledger.add([firmId, group, kind, location, productIds[p], batch, delta, reason, reference, by, at]);
  };
  while (written < spec.movements) {
    const left = spec.movements - written;
    const p = rnd.int(spec.products);
    const v = rnd.int(spec.vans);
    const van = vanIds[v]!;
    const lots = batchesOf(p);
    // The lot in use moves on through the year: first the one now expired, then the short-dated one.
    const current = lots[Math.min(2, Math.floor((written / spec.movements) * 3))]!;
    const onVan = lots.find((b) => balanceOf(van, b) > 0);
    const onVanTotal = lots.reduce((sum, b) => sum + balanceOf(van, b), 0);
    // Vans are topped up towards their target of 3 and used down from it, as a stores run would.
    if (onVan !== undefined && (onVanTotal >= 3 || rnd.next() < 0.6)) {
      if (rnd.next() < 0.04)
        await row('written_off', randomUUID(), van, p, onVan, -1, 'damaged: pack split in the van', null, storesUser);
      else await row('used', randomUUID(), van, p, onVan, -1, 'Cleaning job', null, engineerUser(v));
    } else if (left >= 2) {
      const quantity = 2 + rnd.int(3);
      if (balanceOf(depotId, current) < quantity) {
        receipt += 1;
        await row(
          'received',
          randomUUID(),
          depotId,
          p,
          current,
          60 + rnd.int(60),
          null,
          `PO-${pad(receipt, 6)}`,
          storesUser,
        );
        continue;
      }
      const group = randomUUID();
      await row('transfer_out', group, depotId, p, current, -quantity, null, null, storesUser);
      await row('transfer_in', group, van, p, current, quantity, null, null, storesUser);
    } else {
      receipt += 1;
      await row('received', randomUUID(), depotId, p, current, 24, null, `PO-${pad(receipt, 6)}`, storesUser);
    }
  }
  await ledger.close();
  const balanceRows = new BulkWriter(pool, 'stock_balances', [
    'firm_id',
    'location_id',
    'batch_id',
    'product_id',
    'quantity',
  ]);
  for (const b of balances.values()) await balanceRows.add([firmId, b.location, b.batch, b.product, b.quantity]);
  await balanceRows.close();

  // Kit: rigs of five parts (three in five items), the rest loose; a year of check-outs and check-ins.
  const kinds = new Map(
    ((await db('item_kinds').where({ firm_id: firmId }).select('id', 'name')) as { id: number; name: string }[]).map(
      (k) => [k.name, k.id],
    ),
  );
  const rigParts = ['Filtration rig', 'Magnet set', 'Hose set', 'Manifold and connectors', 'Agitator head'];
  const looseKinds = defaultItemKinds.map((k) => k.name).filter((n) => !rigParts.includes(n));
  const rigCount = Math.floor((spec.kitItems * 0.6) / rigParts.length);
  const kitIds = await insertReturningIds(
    pool,
    'kits',
    ['firm_id', 'name'],
    Array.from({ length: rigCount }, (_, k) => [firmId, `Rig ${pad(k + 1, 4)}`]),
  );
  const items: { kitIndex: number | null; kind: string; tag: string }[] = [];
  for (let k = 0; k < rigCount; k += 1)
    for (const [n, kind] of rigParts.entries()) items.push({ kitIndex: k, kind, tag: `R${pad(k + 1, 4)}-${n + 1}` });
  for (let n = items.length; n < spec.kitItems; n += 1)
    items.push({ kitIndex: null, kind: looseKinds[n % looseKinds.length]!, tag: `L${pad(n + 1, 5)}` });

  // Custody per kit (all its items move together) or per loose item: out to a van, back a few days later.
  const holders: number[] = [];
  const events: unknown[][] = [];
  const inspections: unknown[][] = [];
  const holderOfGroup = new Map<string, number>();
  const eventsOf = (group: string, itemIds: number[], kitId: number | null) => {
    let at = yearAgo + rnd.int(20) * dayMs;
    let holder = depotId;
    while (at < now.getTime() - 2 * dayMs) {
      const van = vanIds[rnd.int(vanIds.length)]!;
      for (const itemId of itemIds)
        events.push([firmId, itemId, kitId, 'check_out', depotId, van, storesUser, null, new Date(at)]);
      holder = van;
      const back = at + (2 + rnd.int(8)) * dayMs;
      if (back >= now.getTime()) break;
      for (const itemId of itemIds)
        events.push([firmId, itemId, kitId, 'check_in', van, depotId, storesUser, 'in_service', new Date(back)]);
      holder = depotId;
      at = back + (3 + rnd.int(20)) * dayMs;
    }
    holderOfGroup.set(group, holder);
  };
  // Item rows first (their ids are needed by the log), all at the depot; the cache is set from the log below.
  const itemIds = await insertReturningIds(
    pool,
    'kit_items',
    ['firm_id', 'kit_id', 'kind_id', 'asset_tag', 'serial_number', 'location_id', 'in_service_since'],
    items.map((it, n) => [
      firmId,
      it.kitIndex === null ? null : kitIds[it.kitIndex],
      kinds.get(it.kind),
      it.tag,
      `SN-${seed}-${pad(n + 1, 6)}`,
      depotId,
      addDays(today, -500),
    ]),
  );
  for (let k = 0; k < rigCount; k += 1)
    eventsOf(`kit:${k}`, itemIds.slice(k * rigParts.length, (k + 1) * rigParts.length), kitIds[k]!);
  for (let n = rigCount * rigParts.length; n < itemIds.length; n += 1) eventsOf(`item:${n}`, [itemIds[n]!], null);
  for (const [n, itemId] of itemIds.entries()) {
    const it = items[n]!;
    holders.push(holderOfGroup.get(it.kitIndex === null ? `item:${n}` : `kit:${it.kitIndex}`)!);
    // Quarterly inspections, the last one 10 to 100 days ago (so some are due and some overdue).
    const lastAgo = 10 + rnd.int(90);
    for (let q = 0; q < 4; q += 1)
      inspections.push([
        firmId,
        itemId,
        'passed',
        storesUser,
        addDays(today, -(lastAgo + q * 91)),
        new Date(now.getTime() - (lastAgo + q * 91) * dayMs),
      ]);
  }
  events.sort((a, b) => (a[8] as Date).getTime() - (b[8] as Date).getTime());
  const eventsBegan = Date.now();
  const custody = new BulkWriter(
    pool,
    'custody_events',
    [
      'firm_id',
      'item_id',
      'kit_id',
      'action',
      'from_location_id',
      'to_location_id',
      'by_user_id',
      'condition',
      'created_at',
    ],
    (n) => progress('custody events', n, events.length, eventsBegan),
    1,
  );
  for (const e of events) await custody.add(e);
  await custody.close();
  const inspectionRows = new BulkWriter(
    pool,
    'inspections',
    ['firm_id', 'item_id', 'result', 'by_user_id', 'inspected_on', 'created_at'],
    undefined,
    1,
  );
  for (const i of inspections) await inspectionRows.add(i);
  await inspectionRows.close();
  // The location cache of each item, from its last event: one UPDATE per holder rather than per item.
  const byHolder = new Map<number, number[]>();
  for (const [n, itemId] of itemIds.entries())
    byHolder.set(holders[n]!, [...(byHolder.get(holders[n]!) ?? []), itemId]);
  for (const [holder, ids] of byHolder)
    if (holder !== depotId)
      await db('kit_items').where('firm_id', firmId).whereIn('id', ids).update({ location_id: holder });

  // Customers, sites and a year of jobs (the past ones completed), each planning two products.
  const customerCount = Math.ceil(spec.jobs * 0.4);
  const customerIds = await insertReturningIds(
    pool,
    'customers',
    ['firm_id', 'name', 'email'],
    Array.from({ length: customerCount }, (_, c) => [
      firmId,
      `${personName(c * 7 + 3)} (${pad(c + 1, 5)})`,
      `customer-${pad(c + 1, 5)}@${spec.domain}`,
    ]),
  );
  const siteIds = await insertReturningIds(
    pool,
    'sites',
    ['firm_id', 'customer_id', 'address', 'postcode'],
    customerIds.map((customerId, c) => [
      firmId,
      customerId,
      `${1 + (c % 90)} ${streets[c % streets.length]}, Bench Town`,
      `BT${1 + (c % 9)} ${c % 10}AB`,
    ]),
  );
  const jobsBegan = Date.now();
  const jobRows: unknown[][] = [];
  for (let j = 0; j < spec.jobs; j += 1) {
    const v = rnd.int(spec.vans);
    const dayOffset = -365 + Math.floor((j / spec.jobs) * 395);
    const done = dayOffset < 0;
    const rads = 4 + rnd.int(14);
    const survey = {
      systemType: rnd.next() < 0.7 ? 'sealed' : 'open_vented',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: Array.from({ length: rads }, (_, r) => ({
        room: `Room ${r + 1}`,
        panel: r % 3 === 0 ? 'double' : 'single',
      })),
      pipeRuns: [],
    };
    const scheduled = addDays(today, dayOffset);
    jobRows.push([
      firmId,
      siteIds[rnd.int(siteIds.length)],
      memberIds[3 + v],
      vanIds[v],
      scheduled,
      done ? 'completed' : 'planned',
      JSON.stringify(survey),
      done ? new Date(now.getTime() + dayOffset * dayMs) : null,
      done ? engineerUser(v) : null,
      done ? addDays(scheduled, 365) : null,
    ]);
  }
  const jobIds = await insertReturningIds(
    pool,
    'jobs',
    [
      'firm_id',
      'site_id',
      'engineer_member_id',
      'van_location_id',
      'scheduled_on',
      'status',
      'survey',
      'completed_at',
      'completed_by_user_id',
      'next_check_on',
    ],
    jobRows,
  );
  const jobProducts = new BulkWriter(pool, 'job_products', ['firm_id', 'job_id', 'product_id']);
  for (const [j, jobId] of jobIds.entries()) {
    await jobProducts.add([firmId, jobId, productIds[(j * 5) % spec.products]]);
    await jobProducts.add([firmId, jobId, productIds[(j * 5 + 1) % spec.products]]);
  }
  await jobProducts.close();
  progress('jobs', spec.jobs, spec.jobs, jobsBegan);

  const seconds = (Date.now() - began) / 1000;
  say(`  done in ${seconds.toFixed(1)} s`);
  return {
    key: spec.key,
    firmId,
    name: spec.name,
    ownerEmail: people[0]!.email,
    engineerEmail: people[3]!.email,
    movements: written,
    custodyEvents: events.length,
    kitItems: itemIds.length,
    jobs: jobIds.length,
    vans: vanIds.length,
    products: productIds.length,
    seconds,
  };
}

/** Every balance of the firm against the sum of its ledger: the number of places and batches that disagree. */
export async function balancesDisagreeingWithLedger(pool: Pool, firmId: number): Promise<number> {
  const [rows] = await pool.query(
    `SELECT COUNT(*) AS n FROM stock_balances s
       LEFT JOIN (SELECT location_id, batch_id, SUM(quantity_delta) AS total FROM stock_movements WHERE firm_id = ? GROUP BY location_id, batch_id) m
         ON m.location_id = s.location_id AND m.batch_id = s.batch_id
      WHERE s.firm_id = ? AND s.quantity <> COALESCE(m.total, 0)`,
    [firmId, firmId],
  );
  const [orphans] = await pool.query(
    `SELECT COUNT(*) AS n FROM (SELECT location_id, batch_id FROM stock_movements WHERE firm_id = ? GROUP BY location_id, batch_id) m
       LEFT JOIN stock_balances s ON s.firm_id = ? AND s.location_id = m.location_id AND s.batch_id = m.batch_id
      WHERE s.firm_id IS NULL`,
    [firmId, firmId],
  );
  return Number((rows as { n: number }[])[0]!.n) + Number((orphans as { n: number }[])[0]!.n);
}
