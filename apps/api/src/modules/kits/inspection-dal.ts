import type { Knex } from 'knex';
import { electricalTestOutcome, type ElectricalTestInput, type Inspection } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export async function insertInspection(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    item_id: number;
    result: Inspection['result'];
    notes: string | null;
    photo_id: number | null;
    by_user_id: number;
    inspected_on: string;
    created_at: Date;
    cleaned_at_check_in?: boolean;
  },
): Promise<number> {
  const [id] = await trx('inspections').insert(row);
  return id as number;
}

export async function insertElectricalTest(
  trx: Knex.Transaction,
  firmId: number,
  inspectionId: number,
  t: ElectricalTestInput,
): Promise<void> {
  await trx('inspection_electrical_tests').insert({
    firm_id: firmId,
    inspection_id: inspectionId,
    equipment_class: t.equipmentClass,
    visual: t.visual,
    earth_continuity_ohms: t.earthContinuityOhms ?? null,
    cord_length_m: t.cordLengthM ?? null,
    cord_size_mm2: t.cordSizeMm2 ?? null,
    insulation_resistance_mohms: t.insulationResistanceMohms ?? null,
    polarity: t.polarity,
    tester_used: t.testerUsed,
    tester_calibrated_on: t.testerCalibratedOn,
  });
}

const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

function electricalOf(r: Record<string, unknown>): Inspection['electrical'] {
  if (r.et_class === null || r.et_class === undefined) return null;
  const input: ElectricalTestInput = {
    equipmentClass: r.et_class as 'I' | 'II',
    visual: r.et_visual as 'pass' | 'fail',
    earthContinuityOhms: num(r.et_earth),
    cordLengthM: num(r.et_cord_length),
    cordSizeMm2: num(r.et_cord_size),
    insulationResistanceMohms: num(r.et_insulation),
    polarity: r.et_polarity as 'pass' | 'fail' | 'not_applicable',
    testerUsed: r.et_tester as string,
    testerCalibratedOn: r.et_calibrated as string,
  };
  return {
    ...input,
    earthContinuityOhms: input.earthContinuityOhms ?? null,
    cordLengthM: input.cordLengthM ?? null,
    cordSizeMm2: input.cordSizeMm2 ?? null,
    insulationResistanceMohms: input.insulationResistanceMohms ?? null,
    ...electricalTestOutcome(input),
  };
}

export async function listInspections(db: Db, firmId: number, itemIds: number[]): Promise<Inspection[]> {
  if (itemIds.length === 0) return [];
  const rows = (await db('inspections as ins')
    .join('users as u', 'u.id', 'ins.by_user_id')
    .leftJoin('inspection_electrical_tests as et', function joinTest() {
      this.on('et.inspection_id', '=', 'ins.id').andOn('et.firm_id', '=', 'ins.firm_id');
    })
    .where('ins.firm_id', firmId)
    .whereIn('ins.item_id', itemIds)
    .orderBy('ins.id', 'desc')
    .limit(200)
    .select(
      'ins.*',
      'u.name as by_name',
      'et.equipment_class as et_class',
      'et.visual as et_visual',
      'et.earth_continuity_ohms as et_earth',
      'et.cord_length_m as et_cord_length',
      'et.cord_size_mm2 as et_cord_size',
      'et.insulation_resistance_mohms as et_insulation',
      'et.polarity as et_polarity',
      'et.tester_used as et_tester',
      'et.tester_calibrated_on as et_calibrated',
    )) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    itemId: r.item_id as number,
    result: r.result as Inspection['result'],
    notes: (r.notes as string | null) ?? null,
    photoId: (r.photo_id as number | null) ?? null,
    byName: r.by_name as string,
    inspectedOn: r.inspected_on as string,
    createdAt: (r.created_at as Date).toISOString(),
    cleanedAtCheckIn: Boolean(r.cleaned_at_check_in),
    electrical: electricalOf(r),
  }));
}
