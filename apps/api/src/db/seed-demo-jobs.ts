import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import {
  addDays,
  addMonths,
  calendarDateIn,
  dosePlan,
  inhibitorCheck,
  completionChecks,
  surveySchema,
  surveyVolume,
  systemDetailsSchema,
  type Survey,
  type SystemDetails,
  DEFAULT_TIME_ZONE,
} from '@heatfleet/domain';

type Trx = Knex.Transaction;

// Invented customers, streets and visits for the demo; no real person or address.
const firstNames = [
  'Odile',
  'Harlan',
  'Tamsin',
  'Bram',
  'Elowen',
  'Corin',
  'Ysolde',
  'Fenn',
  'Marit',
  'Osric',
  'Liesl',
  'Teodor',
  'Wynne',
  'Anouk',
  'Caspian',
  'Reva',
  'Idris',
  'Solvei',
  'Jago',
  'Perpetua',
  'Lorcan',
  'Maelle',
  'Tobiah',
  'Ondine',
];
const surnames = [
  'Farrant',
  'Strood',
  'Vell',
  'Quillby',
  'Marchbank',
  'Trevennor',
  'Ashgrove',
  'Pellow',
  'Hartwick',
  'Dunmore',
  'Corbell',
  'Elsworth',
  'Faircloth',
  'Gorrell',
  'Kestle',
  'Lanyon',
  'Mabbott',
  'Nancarrow',
  'Orchardson',
  'Penhallow',
  'Rosewarne',
  'Stannard',
  'Tregear',
  'Wetherall',
];
const streets = [
  'Weir Cottages',
  'Sluice Row',
  'Mill Hill',
  'Tanners Lane',
  'Copse Road',
  'Bridgefoot',
  'Lockkeeper Close',
  'Orchard Rise',
  'Fuller Street',
  'Kiln Lane',
  'Ropewalk',
  'Heron Way',
  'Chapel Steps',
  'Furnace Road',
  'Wharf Terrace',
  'Beacon View',
];
const rooms = [
  'Lounge',
  'Kitchen',
  'Hall',
  'Dining room',
  'Bedroom 1',
  'Bedroom 2',
  'Bedroom 3',
  'Bedroom 4',
  'Bathroom',
  'Landing',
  'Study',
  'En suite',
  'Utility',
  'Conservatory',
];
const panels = ['single', 'single_fins', 'double', 'double_fins', 'double', 'single_fins'] as const;

/** A small deterministic generator, so every demo seed tells the same story. */
function randomFrom(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: <T>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)]!,
  };
}

/** A survey as an engineer would enter it, checked by the same schema the API uses. */
function surveyFor(r: ReturnType<typeof randomFrom>): Survey {
  const count = r.int(5, 14);
  const radiators = Array.from({ length: count }, (_, i) => {
    const rail = i === count - 1 && r.next() < 0.6;
    const panel = r.pick(panels);
    return rail
      ? { room: 'Bathroom', panel: 'towel_rail' as const, litres: 3 }
      : {
          room: rooms[i % rooms.length]!,
          panel,
          heightMm: r.pick([450, 600, 600, 700]),
          lengthMm: r.pick([600, 800, 1000, 1200, 1400, 1600]),
          ratedWatts: r.int(6, 24) * 100,
        };
  });
  const boilerKind = r.pick(['combi', 'combi', 'system', 'regular'] as const);
  return surveySchema.parse({
    systemType: boilerKind === 'regular' ? 'open_vented' : 'sealed',
    boilerKind,
    fuel: r.next() < 0.9 ? 'gas' : 'oil',
    cylinderCoilLitres: boilerKind === 'combi' ? null : 5,
    radiators,
    pipeRuns: [
      { tube: '15', lengthM: r.int(25, 60) },
      { tube: '22', lengthM: r.int(6, 18) },
    ],
  });
}

// Invented makers and models: no real brand.
const boilerMakes = ['Fennick Heat', 'Oldcastle Thermal', 'Marrowby Boilers'];
const boilerLocations = ['Kitchen', 'Utility', 'Airing cupboard', 'Garage', 'Loft'];

/** What the report says about the system, as an engineer would note it on the visit. */
function systemDetailsFor(r: ReturnType<typeof randomFrom>, survey: Survey): SystemDetails {
  return systemDetailsSchema.parse({
    boilerMake: r.pick(boilerMakes),
    boilerModel: `${r.pick(['FH', 'OT', 'MB'])} ${r.int(18, 35)}${survey.boilerKind === 'combi' ? 'c' : ''}`,
    boilerLocation: r.pick(boilerLocations),
    magneticFilterFitted: r.next() < 0.6,
    cisternCondition:
      survey.systemType === 'open_vented' ? r.pick(['clean', 'dirty_cleaned', 'needs_attention']) : null,
  });
}

const at = (day: string, hourUtc: number) => new Date(`${day}T${String(hourUtc).padStart(2, '0')}:00:00Z`);

/**
 * A year of completed cleaning visits at Brackenford, about three a week across its five engineers,
 * with their chemicals taken off the vans by 'used' movements. Each month has its own batch of
 * cleaner and inhibitor, received at the depot and sent out to the vans just before the month's
 * jobs, so every batch's balance (zero once used) stays equal to its ledger. Sites cleaned 11 to 12
 * months ago fall due their annual check; a few have had their check visit already. Then the three
 * booked visits of engineer@ that the browser tests use.
 */
export async function seedDemoJobs(
  trx: Trx,
  firmIds: { brackenford: number; tarnside: number },
  now: Date,
): Promise<void> {
  const today = calendarDateIn(now, DEFAULT_TIME_ZONE);
  const firmId = firmIds.brackenford;
  const r = randomFrom(20261202);
  const depot = (await trx('locations').where({ firm_id: firmId, kind: 'depot' }).first('id')) as { id: number };
  const stores = ((await trx('users').where({ email: 'stores@brackenford.example' }).first('id')) as { id: number }).id;
  const crews = (await trx('locations as l')
    .join('memberships as m', (j) => j.on('m.id', '=', 'l.engineer_member_id').andOn('m.firm_id', '=', 'l.firm_id'))
    .where({ 'l.firm_id': firmId, 'l.kind': 'van' })
    .orderBy('l.id')
    .select('l.id as van_id', 'm.id as member_id', 'm.user_id')) as {
    van_id: number;
    member_id: number;
    user_id: number;
  }[];
  const productRows = (await trx('products')
    .where({ firm_id: firmId })
    .whereIn('name', ['HFL System Cleaner', 'HFL Rapid Cleaner', 'HFL Inhibitor'])
    .select(
      'id',
      'name',
      'kind',
      'pack_size_ml',
      'dose_litres_per_100l',
      'radiators_per_pack',
      'target_min',
      'target_max',
      'target_unit',
    )) as {
    id: number;
    name: string;
    kind: string;
    pack_size_ml: number;
    dose_litres_per_100l: string | null;
    radiators_per_pack: number | null;
    target_min: string | null;
    target_max: string | null;
    target_unit: string | null;
  }[];
  const byName = new Map(productRows.map((p) => [p.name, p]));
  const inhibitor = byName.get('HFL Inhibitor')!;

  // The visits: working days over the last 52 weeks, two to four a week, none today or later.
  type Visit = {
    day: string;
    crew: (typeof crews)[number];
    survey: Survey;
    cleaner: (typeof productRows)[number];
    customer: string;
    address: string;
    postcode: string;
  };
  const visits: Visit[] = [];
  const start = addDays(today, -364);
  const firstMonday = addDays(start, -((new Date(`${start}T00:00:00Z`).getUTCDay() + 6) % 7));
  for (let week = 0; week <= 52; week += 1) {
    const n = r.int(2, 4);
    const days = new Set<number>();
    while (days.size < n) days.add(r.int(0, 4));
    for (const d of [...days].sort()) {
      const day = addDays(firstMonday, week * 7 + d);
      if (day < start || day >= today) continue;
      const houseNumber = r.int(1, 120);
      visits.push({
        day,
        crew: r.pick(crews),
        survey: surveyFor(r),
        cleaner: r.next() < 0.8 ? byName.get('HFL System Cleaner')! : byName.get('HFL Rapid Cleaner')!,
        customer: `${r.pick(firstNames)} ${r.pick(surnames)}`,
        address: `${houseNumber} ${r.pick(streets)}, Brackenford`,
        postcode: `BF${r.int(1, 4)} ${r.int(1, 9)}${r.pick(['AX', 'LN', 'QD', 'TW', 'HR', 'PE'])}`,
      });
    }
  }

  const customerRows = visits.map((v) => ({
    firm_id: firmId,
    name: v.customer,
    email: `${v.customer.toLowerCase().replace(/[^a-z]+/g, '.')}@customer.example`,
    phone: `01632 ${String(r.int(100000, 999999))}`,
  }));
  const firstCustomerId = ((await trx('customers').insert(customerRows)) as number[])[0]!;
  // MariaDB hands out consecutive ids to one multi-row insert (innodb_autoinc_lock_mode 1 or 2 without concurrent inserts).
  const customerIds = await consecutiveIds(trx, 'customers', firmId, firstCustomerId, visits.length);
  const siteRows = visits.map((v, i) => ({
    firm_id: firmId,
    customer_id: customerIds[i]!,
    address: v.address,
    postcode: v.postcode,
    access_notes: r.next() < 0.3 ? 'Key with the neighbour at number 2.' : null,
    system_notes: null,
  }));
  const firstSiteId = ((await trx('sites').insert(siteRows)) as number[])[0]!;
  const siteIds = await consecutiveIds(trx, 'sites', firmId, firstSiteId, visits.length);

  // Report numbers in the order the visits were completed (the visits are in date order), HF-000001 on.
  const jobRows = visits.map((v, i) => {
    const completedOn = v.day;
    return {
      firm_id: firmId,
      site_id: siteIds[i]!,
      engineer_member_id: v.crew.member_id,
      van_location_id: v.crew.van_id,
      scheduled_on: v.day,
      status: 'completed',
      visit_kind: 'full_clean',
      survey: JSON.stringify(v.survey),
      system_details: JSON.stringify(systemDetailsFor(r, v.survey)),
      completed_at: at(completedOn, 15),
      completed_by_user_id: v.crew.user_id,
      next_check_on: addMonths(completedOn, 12),
      report_number: i + 1,
    };
  });
  const firstJobId = ((await trx('jobs').insert(jobRows)) as number[])[0]!;
  const jobIds = await consecutiveIds(trx, 'jobs', firmId, firstJobId, visits.length);
  await trx('firms').where({ id: firmId }).update({ last_report_number: visits.length });

  // About one visit in twelve was completed without its water test, with the engineer's reason.
  const noTest = completionChecks({
    visitKind: 'full_clean',
    circulation: { minimumMinutes: null, startedAt: null, elapsedMinutes: null, met: null },
    radiators: [],
    water: { mainsTdsPpm: null, systemTdsPpm: null, inhibitorReading: null },
  })[0]!;
  const reasonRows = jobIds
    .filter((_, i) => i % 12 === 5)
    .map((jobId, n) => ({
      firm_id: firmId,
      job_id: jobId,
      code: noTest.code,
      found: noTest.found,
      reason:
        n % 2
          ? 'Test kit left at the depot; customer to be rung with the result of a sample.'
          : 'Customer had to leave; sample taken for testing at the depot.',
    }));
  if (reasonRows.length) await trx('job_completion_reasons').insert(reasonRows);

  // Chemicals per job by the same dose plan the app uses, grouped by month and van for the deliveries.
  const used: { jobIndex: number; product: (typeof productRows)[number]; packs: number }[] = [];
  visits.forEach((v, i) => {
    const volume = surveyVolume(v.survey).totalLitres;
    for (const product of [v.cleaner, inhibitor]) {
      const plan = dosePlan(volume, v.survey.radiators.length, {
        packSizeMl: product.pack_size_ml,
        doseLitresPer100L: product.dose_litres_per_100l === null ? null : Number(product.dose_litres_per_100l),
        radiatorsPerPack: product.radiators_per_pack,
      });
      used.push({ jobIndex: i, product, packs: Math.max(1, plan.packs) });
    }
  });
  await trx('job_products').insert(
    used.map((u) => ({ firm_id: firmId, job_id: jobIds[u.jobIndex]!, product_id: u.product.id })),
  );

  const months = [...new Set(visits.map((v) => v.day.slice(0, 7)))].sort();
  const batchRows = months.flatMap((m, mi) =>
    productRows.map((p, pi) => ({
      firm_id: firmId,
      product_id: p.id,
      lot_number: `H${m.replace('-', '')}${pi}`,
      expires_on: addMonths(`${m}-01`, 30),
      _key: `${m}:${p.id}`,
      _order: mi,
    })),
  );
  const firstBatchId = (
    (await trx('product_batches').insert(batchRows.map(({ _key, _order, ...row }) => row))) as number[]
  )[0]!;
  const batchIds = await consecutiveIds(trx, 'product_batches', firmId, firstBatchId, batchRows.length);
  const batchOf = new Map(batchRows.map((b, i) => [b._key, batchIds[i]!]));

  const movements: Record<string, unknown>[] = [];
  const balances = new Map<string, { location_id: number; batch_id: number; product_id: number; quantity: number }>();
  const move = (
    kind: string,
    locationId: number,
    productId: number,
    batchId: number,
    delta: number,
    by: number,
    when: Date,
    extra: { job_id?: number; reason?: string; reference?: string; group_id?: string } = {},
  ) => {
    movements.push({
      firm_id: firmId,
      group_id: extra.group_id ?? randomUUID(),
      kind,
      location_id: locationId,
      product_id: productId,
      batch_id: batchId,
      quantity_delta: delta,
      reason: extra.reason ?? null,
      reference: extra.reference ?? null,
      job_id: extra.job_id ?? null,
      by_user_id: by,
      created_at: when,
    });
    const key = `${locationId}:${batchId}`;
    const b = balances.get(key) ?? { location_id: locationId, batch_id: batchId, product_id: productId, quantity: 0 };
    b.quantity += delta;
    balances.set(key, b);
  };
  for (const m of months) {
    const monthStart = `${m}-01`;
    for (const p of productRows) {
      const batchId = batchOf.get(`${m}:${p.id}`)!;
      const lines = used.filter((u) => u.product.id === p.id && visits[u.jobIndex]!.day.startsWith(m));
      const total = lines.reduce((n, u) => n + u.packs, 0);
      if (total === 0) continue;
      move('received', depot.id, p.id, batchId, total, stores, at(addDays(monthStart, -3), 9), {
        reference: `DEL-${m.replace('-', '')}-${p.id}`,
      });
      for (const crew of crews) {
        const packs = lines
          .filter((u) => visits[u.jobIndex]!.crew.van_id === crew.van_id)
          .reduce((n, u) => n + u.packs, 0);
        if (packs === 0) continue;
        const group = randomUUID();
        move('transfer_out', depot.id, p.id, batchId, -packs, stores, at(addDays(monthStart, -2), 8), {
          group_id: group,
        });
        move('transfer_in', crew.van_id, p.id, batchId, packs, stores, at(addDays(monthStart, -2), 8), {
          group_id: group,
        });
      }
      for (const u of lines) {
        const v = visits[u.jobIndex]!;
        move('used', v.crew.van_id, p.id, batchId, -u.packs, v.crew.user_id, at(v.day, 15), {
          job_id: jobIds[u.jobIndex]!,
          reason: `Job ${jobIds[u.jobIndex]!}`,
        });
      }
    }
  }
  for (let i = 0; i < movements.length; i += 500) await trx('stock_movements').insert(movements.slice(i, i + 500));
  await trx('stock_balances').insert([...balances.values()].map((b) => ({ firm_id: firmId, ...b })));

  // Inhibitor check visits at five of the sites cleaned 320 to 364 days ago (one found low); the
  // others cleaned 335 days ago or more are due their check within 30 days.
  const nextCheck = visits.map((v) => addMonths(v.day, 12));
  const checkRows: Record<string, unknown>[] = [];
  const range = { min: Number(inhibitor.target_min), max: Number(inhibitor.target_max) };
  const candidates = visits
    .map((v, i) => ({ v, i }))
    .filter(({ v }) => v.day <= addDays(today, -320) && v.day >= addDays(today, -364));
  for (const [n, { v, i }] of candidates
    .filter((_, k) => k % 3 === 0)
    .slice(0, 5)
    .entries()) {
    const checkedOn = addDays(v.day, 310 + n * 3) < today ? addDays(v.day, 310 + n * 3) : addDays(today, -1);
    const reading = n === 2 ? 0.8 : 1.2;
    checkRows.push({
      firm_id: firmId,
      site_id: siteIds[i]!,
      checked_on: checkedOn,
      product_id: inhibitor.id,
      reading,
      target_min: range.min,
      target_max: range.max,
      target_unit: inhibitor.target_unit,
      tds_ppm: r.int(150, 260),
      result: inhibitorCheck(reading, range) === 'pass' ? 'pass' : 'fail',
      notes: n === 2 ? 'Low reading: topped up with half a pack and retested.' : 'Water clear; no cold spots.',
      by_user_id: v.crew.user_id,
      created_at: at(checkedOn, 11),
    });
    nextCheck[i] = addMonths(checkedOn, 12);
  }
  if (checkRows.length) await trx('site_checks').insert(checkRows);
  // One UPDATE per site would be 150 round trips: a CASE sets them all at once.
  const cases = siteIds.map(() => 'WHEN ? THEN ?').join(' ');
  await trx.raw(
    `UPDATE sites SET next_check_on = CASE id ${cases} END WHERE firm_id = ? AND id IN (${siteIds.map(() => '?').join(',')})`,
    [...siteIds.flatMap((id, i) => [id, nextCheck[i]!]), firmId, ...siteIds],
  );

  // Agitation on the latest completed job, so the overview's vibration card has a figure for that day.
  const last = visits.length - 1;
  if (last >= 0) {
    const v = visits[last]!;
    await trx('job_agitations').insert(
      v.survey.radiators.map((_, index) => ({
        firm_id: firmId,
        job_id: jobIds[last]!,
        radiator_index: index,
        minutes: 5,
        magnitude_ms2: 6.5,
        engineer_member_id: v.crew.member_id,
        recorded_on: v.day,
        recorded_by_user_id: v.crew.user_id,
        recorded_at: at(v.day, 13),
      })),
    );
  }

  // The contact details the customer's report prints (01632 960 is a range kept for drama, never a real line).
  await trx('firms').where({ id: firmId }).update({
    phone: '01632 960 418',
    email: 'office@brackenford.example',
    registration_numbers: 'Heating trade scheme no. 000418 (invented)',
  });

  await seedBookedVisits(trx, firmId, today);
}

/** The ids of rows just inserted in one statement, read back rather than assumed. */
async function consecutiveIds(
  trx: Trx,
  table: string,
  firmId: number,
  firstId: number,
  count: number,
): Promise<number[]> {
  const rows = (await trx(table)
    .where('firm_id', firmId)
    .where('id', '>=', firstId)
    .orderBy('id')
    .limit(count)
    .select('id')) as { id: number }[];
  if (rows.length !== count) throw new Error(`Expected ${count} new ${table} rows, found ${rows.length}.`);
  return rows.map((row) => row.id);
}

// Three booked visits for engineer@ (the browser tests use them), so the jobs list and a plan have something to show.
async function seedBookedVisits(trx: Trx, firmId: number, today: string): Promise<void> {
  const engineer = (await trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'u.email': 'engineer@brackenford.example' })
    .first('m.id')) as { id: number };
  const van = (await trx('locations').where({ firm_id: firmId, engineer_member_id: engineer.id }).first('id')) as {
    id: number;
  };
  const products = (await trx('products')
    .where({ firm_id: firmId })
    .whereIn('name', ['HFL System Cleaner', 'HFL Inhibitor'])
    .select('id')) as { id: number }[];
  const visits = [
    {
      name: 'Odile Farrant',
      address: '14 Weir Cottages, Brackenford',
      postcode: 'BF2 4LN',
      in: 2,
      rads: 9,
      oil: false,
    },
    { name: 'Harlan Strood', address: '3 Sluice Row, Brackenford', postcode: 'BF1 8QD', in: 5, rads: 14, oil: true },
    {
      name: 'Tamsin Vell',
      address: 'Flat 2, 40 Mill Hill, Brackenford',
      postcode: 'BF3 1AX',
      in: 9,
      rads: 6,
      oil: false,
    },
  ];
  for (const v of visits) {
    const [customerId] = (await trx('customers').insert({
      firm_id: firmId,
      name: v.name,
      email: `${v.name.split(' ')[0]!.toLowerCase()}@customer.example`,
    })) as number[];
    const roomNames = Array.from({ length: v.rads }, (_, i) => `Room ${i + 1}`);
    const [siteId] = (await trx('sites').insert({
      firm_id: firmId,
      customer_id: customerId,
      address: v.address,
      postcode: v.postcode,
      access_notes: 'Ring ahead; parking on the street.',
      // The oil system was cleaned before: its flush order, furthest from the rig first, is kept.
      flush_order: v.oil ? JSON.stringify([...roomNames].reverse()) : null,
    })) as number[];
    // An open-vented oil system with a floor-standing regular boiler, or a sealed gas combi.
    const survey = {
      systemType: v.oil ? 'open_vented' : 'sealed',
      boilerKind: v.oil ? 'regular' : 'combi',
      fuel: v.oil ? 'oil' : 'gas',
      radiators: roomNames.map((room, i) => ({ room, panel: i % 3 === 0 ? 'double' : 'single' })),
      pipeRuns: [],
    };
    const systemDetails = v.oil
      ? {
          boilerMake: 'Oldcastle Thermal',
          boilerModel: 'OT 26',
          boilerLocation: 'Utility',
          magneticFilterFitted: false,
          cisternCondition: null,
        }
      : { boilerMake: 'Fennick Heat', boilerLocation: 'Kitchen', magneticFilterFitted: true };
    const [jobId] = (await trx('jobs').insert({
      firm_id: firmId,
      site_id: siteId,
      engineer_member_id: engineer.id,
      van_location_id: van.id,
      scheduled_on: addDays(today, v.in),
      visit_kind: 'full_clean',
      survey: JSON.stringify(survey),
      system_details: JSON.stringify(systemDetailsSchema.parse(systemDetails)),
    })) as number[];
    await trx('job_products').insert(products.map((p) => ({ firm_id: firmId, job_id: jobId, product_id: p.id })));
  }
}
