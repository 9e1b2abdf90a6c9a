import type { Knex } from 'knex';
import { addDays, calendarDateIn, DEFAULT_TIME_ZONE } from '@heatfleet/domain';

// Invented vans, kits and a few months of custody for the demo firms. Registrations are made up.
const brackenfordVans = [
  { name: 'Van 1', registration: 'HF21 BRK', engineer: 'engineer@brackenford.example', motIn: 12, serviceIn: 140 },
  {
    name: 'Van 2',
    registration: 'HF70 BRK',
    engineer: 'aled.fenwright@brackenford.example',
    motIn: 200,
    serviceIn: 25,
  },
  { name: 'Van 3', registration: 'HF19 BRK', engineer: 'kit.marrable@brackenford.example', motIn: 95, serviceIn: -3 },
  { name: 'Van 4', registration: 'HF72 BRK', engineer: 'sol.haverick@brackenford.example', motIn: 300, serviceIn: 180 },
  { name: 'Van 5', registration: 'HF23 BRK', engineer: 'multi@heatfleet.example', motIn: 60, serviceIn: 90 },
];

const kitParts = [
  { suffix: '', kind: 'Filtration rig' },
  { suffix: '-MAG', kind: 'Magnet set' },
  { suffix: '-HOSE', kind: 'Hose set' },
  { suffix: '-MAN', kind: 'Manifold and connectors' },
  { suffix: '-AGI', kind: 'Agitator head' },
];

type Trx = Knex.Transaction;

async function ids(trx: Trx, table: string, firmId: number, key: string): Promise<Map<string, number>> {
  const rows = (await trx(table).where({ firm_id: firmId }).select('id', key)) as Record<string, string | number>[];
  return new Map(rows.map((r) => [String(r[key]), Number(r.id)]));
}

async function memberIdOf(trx: Trx, firmId: number, email: string): Promise<number> {
  const row = await trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'u.email': email })
    .first('m.id');
  return row.id as number;
}

async function userIdOf(trx: Trx, email: string): Promise<number> {
  return ((await trx('users').where({ email }).first('id')) as { id: number }).id;
}

export async function seedDemoFleet(
  trx: Trx,
  firmIds: { brackenford: number; tarnside: number },
  now: Date,
): Promise<void> {
  const today = calendarDateIn(now, DEFAULT_TIME_ZONE);
  const daysAgo = (n: number) => new Date(now.getTime() - n * 86_400_000);

  // Brackenford: five vans, four rigs (three out on vans), loose cameras and a pump.
  const firmId = firmIds.brackenford;
  const depot = (await trx('locations').where({ firm_id: firmId, kind: 'depot' }).first('id')) as { id: number };
  await trx('locations').where({ id: depot.id }).update({ name: 'Millrace Yard depot' });
  const vanIds: number[] = [];
  for (const v of brackenfordVans) {
    const [id] = await trx('locations').insert({
      firm_id: firmId,
      kind: 'van',
      name: v.name,
      registration: v.registration,
      engineer_member_id: await memberIdOf(trx, firmId, v.engineer),
      mot_due_on: addDays(today, v.motIn),
      service_due_on: addDays(today, v.serviceIn),
    });
    vanIds.push(id as number);
  }
  const kinds = await ids(trx, 'item_kinds', firmId, 'name');
  const stores = await userIdOf(trx, 'stores@brackenford.example');

  for (let n = 1; n <= 4; n += 1) {
    const [kitId] = await trx('kits').insert({
      firm_id: firmId,
      name: `Rig ${n}`,
      notes: n === 4 ? 'Spare rig kept at the depot.' : null,
    });
    const onVan = n <= 3 ? vanIds[n - 1]! : null;
    for (const part of kitParts) {
      const [itemId] = await trx('kit_items').insert({
        firm_id: firmId,
        kit_id: kitId,
        kind_id: kinds.get(part.kind)!,
        asset_tag: `RIG${n}${part.suffix}`,
        serial_number: `SN-${1000 + n * 10 + kitParts.indexOf(part)}`,
        location_id: onVan ?? depot.id,
        in_service_since: addDays(today, -400),
        // Rig 3's agitator failed its last check and is waiting for repair.
        condition: n === 3 && part.kind === 'Agitator head' ? 'needs_attention' : 'in_service',
        // An invented magnitude for the demo's vibration points; a firm enters its own tool's figure.
        vibration_ms2: part.kind === 'Agitator head' ? (n === 2 ? 6.2 : 8.5) : null,
      });
      // Inspected 20 days ago (rigs 1, 2, 4) or 100 days ago (rig 3, now overdue on its 90-day kinds).
      const inspectedAgo = n === 3 ? 100 : 20;
      await trx('inspections').insert({
        firm_id: firmId,
        item_id: itemId,
        result: n === 3 && part.kind === 'Agitator head' ? 'failed' : 'passed',
        notes: n === 3 && part.kind === 'Agitator head' ? 'Head loose on its mount; sent for repair.' : null,
        by_user_id: stores,
        inspected_on: addDays(today, -inspectedAgo),
        created_at: daysAgo(inspectedAgo),
      });
      // A check-out and back for the history, then (rigs 1-3) out again to their van.
      await trx('custody_events').insert([
        {
          firm_id: firmId,
          item_id: itemId,
          kit_id: kitId,
          action: 'check_out',
          from_location_id: depot.id,
          to_location_id: vanIds[n % 5]!,
          by_user_id: stores,
          created_at: daysAgo(30),
        },
        {
          firm_id: firmId,
          item_id: itemId,
          kit_id: kitId,
          action: 'check_in',
          from_location_id: vanIds[n % 5]!,
          to_location_id: depot.id,
          by_user_id: stores,
          condition: 'in_service',
          created_at: daysAgo(28),
        },
        ...(onVan
          ? [
              {
                firm_id: firmId,
                item_id: itemId,
                kit_id: kitId,
                action: 'check_out',
                from_location_id: depot.id,
                to_location_id: onVan,
                by_user_id: stores,
                created_at: daysAgo(7),
              },
            ]
          : []),
      ]);
    }
  }
  for (const [tag, kind, ago] of [
    ['TC-01', 'Thermal camera', 200],
    ['TC-02', 'Thermal camera', 350],
    ['FP-01', 'Flushing pump', 40],
    ['DH-01', 'Drain hose', 60],
  ] as const) {
    const [itemId] = await trx('kit_items').insert({
      firm_id: firmId,
      kind_id: kinds.get(kind)!,
      asset_tag: tag,
      location_id: depot.id,
      in_service_since: addDays(today, -500),
    });
    await trx('inspections').insert({
      firm_id: firmId,
      item_id: itemId,
      result: 'passed',
      by_user_id: stores,
      inspected_on: addDays(today, -ago),
      created_at: daysAgo(ago),
    });
  }

  // Tarnside: one van and one rig, to show that firms never see each other.
  const tarnside = firmIds.tarnside;
  const tDepot = (await trx('locations').where({ firm_id: tarnside, kind: 'depot' }).first('id')) as { id: number };
  await trx('locations').insert({
    firm_id: tarnside,
    kind: 'van',
    name: 'Fell van',
    registration: 'TS22 PLB',
    engineer_member_id: await memberIdOf(trx, tarnside, 'ned.quarrie@tarnside.example'),
    mot_due_on: addDays(today, 150),
    service_due_on: addDays(today, 20),
  });
  const tKinds = await ids(trx, 'item_kinds', tarnside, 'name');
  const [tKit] = await trx('kits').insert({ firm_id: tarnside, name: 'Tarn rig' });
  for (const part of kitParts.slice(0, 3)) {
    await trx('kit_items').insert({
      firm_id: tarnside,
      kit_id: tKit,
      kind_id: tKinds.get(part.kind)!,
      asset_tag: `TARN${part.suffix || '-RIG'}`,
      location_id: tDepot.id,
      in_service_since: addDays(today, -100),
    });
  }
}
