import { ForbiddenError } from '@casl/ability';
import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { DEFAULT_MIN_SHELF_LIFE_DAYS, packSizeMl, type Product, type ProductInput } from '@heatfleet/domain';
import type { Readable } from 'node:stream';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notFound } from '../../lib/http-error.ts';
import {
  findProductRef,
  findProductRow,
  insertProduct,
  listProductRows,
  productNameTaken,
  updateProductRow,
  type ProductRow,
  type ProductWrite,
} from './product-dal.ts';

const num = (v: string | null) => (v === null ? null : Number(v));

export function toProduct(r: ProductRow): Product {
  return {
    id: r.id,
    name: r.name,
    kind: r.kind,
    ownKind: r.own_kind,
    packSizeMl: r.pack_size_ml,
    doseLitresPer100L: num(r.dose_litres_per_100l),
    radiatorsPerPack: r.radiators_per_pack,
    targetMin: num(r.target_min),
    targetMax: num(r.target_max),
    targetUnit: r.target_unit,
    testMethod: r.test_method,
    shelfLifeMonths: r.shelf_life_months,
    hazardNotes: r.hazard_notes,
    minCirculationMinutes: r.min_circulation_minutes ?? null,
    minShelfLifeDays: r.min_shelf_life_days ?? DEFAULT_MIN_SHELF_LIFE_DAYS,
    supplierCode: r.supplier_code ?? null,
    costPricePence: r.cost_price_pence ?? null,
    safetyDataSheet:
      r.sds_object_key && r.sds_uploaded_at
        ? {
            url: `/api/products/${r.id}/safety-data-sheet`,
            byteSize: r.sds_byte_size ?? 0,
            uploadedAt: r.sds_uploaded_at.toISOString(),
          }
        : null,
    active: Boolean(r.active),
  };
}

const toRow = (p: Partial<ProductInput>): ProductWrite => ({
  ...(p.name !== undefined && { name: p.name }),
  ...(p.kind !== undefined && { kind: p.kind, own_kind: p.kind === 'other' ? (p.ownKind ?? null) : null }),
  ...(p.packSize !== undefined && p.packUnit !== undefined && { pack_size_ml: packSizeMl(p.packSize, p.packUnit) }),
  ...(p.doseLitresPer100L !== undefined && { dose_litres_per_100l: p.doseLitresPer100L }),
  ...(p.radiatorsPerPack !== undefined && { radiators_per_pack: p.radiatorsPerPack }),
  ...(p.targetMin !== undefined && { target_min: p.targetMin }),
  ...(p.targetMax !== undefined && { target_max: p.targetMax }),
  ...(p.targetUnit !== undefined && { target_unit: p.targetUnit }),
  ...(p.testMethod !== undefined && { test_method: p.testMethod }),
  ...(p.shelfLifeMonths !== undefined && { shelf_life_months: p.shelfLifeMonths }),
  ...(p.hazardNotes !== undefined && { hazard_notes: p.hazardNotes }),
  ...(p.minCirculationMinutes !== undefined && { min_circulation_minutes: p.minCirculationMinutes }),
  // Left out: unchanged (on a new product the column's default, 90 days, stands).
  ...(p.minShelfLifeDays !== undefined && { min_shelf_life_days: p.minShelfLifeDays }),
  ...(p.supplierCode !== undefined && { supplier_code: p.supplierCode }),
  ...(p.costPricePence !== undefined && { cost_price_pence: p.costPricePence }),
});

export async function listProducts(deps: AppDeps, actor: Actor): Promise<Product[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Product');
  return (await listProductRows(deps.db, actor.firmId)).map(toProduct);
}

export async function getProduct(deps: AppDeps, actor: Actor, id: number): Promise<Product> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Product');
  const row = await findProductRow(deps.db, actor.firmId, id);
  if (!row) throw notFound('That product');
  return toProduct(row);
}

export async function createProduct(deps: AppDeps, actor: Actor, input: ProductInput): Promise<Product> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Product');
  const id = await deps.db.transaction(async (trx) => {
    if (await productNameTaken(trx, actor.firmId, input.name))
      throw conflict(`There is already a product called "${input.name}".`);
    return insertProduct(trx, actor.firmId, toRow(input));
  });
  return getProduct(deps, actor, id);
}

export async function updateProduct(deps: AppDeps, actor: Actor, id: number, input: ProductInput): Promise<Product> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Product');
  await deps.db.transaction(async (trx) => {
    const row = await findProductRef(trx, actor.firmId, id, { forUpdate: true });
    if (!row) throw notFound('That product');
    if (input.name !== row.name && (await productNameTaken(trx, actor.firmId, input.name)))
      throw conflict(`There is already a product called "${input.name}".`);
    await updateProductRow(trx, actor.firmId, id, toRow(input));
  });
  return getProduct(deps, actor, id);
}

export const SDS_MAX_BYTES = 10 * 1024 * 1024;

/** Stores a product's safety data sheet: a PDF by its content, under the firm's prefix. */
export async function saveSafetyDataSheet(deps: AppDeps, actor: Actor, id: number, file: Buffer): Promise<Product> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Product');
  const row = await findProductRow(deps.db, actor.firmId, id);
  if (!row) throw notFound('That product');
  const type = await fileTypeFromBuffer(file);
  if (type?.mime !== 'application/pdf') {
    throw new HttpError(422, 'A safety data sheet must be a PDF file.', 'ValidationFailed', [
      { path: 'file', message: 'Upload a PDF.' },
    ]);
  }
  const key = `firms/${actor.firmId}/safety-data-sheets/${randomUUID()}.pdf`;
  await deps.objectStore.put(key, file, 'application/pdf');
  try {
    await updateProductRow(deps.db, actor.firmId, id, {
      sds_object_key: key,
      sds_byte_size: file.length,
      sds_uploaded_at: deps.clock.now(),
    });
  } catch (err) {
    await deps.objectStore.delete(key).catch(() => undefined);
    throw err;
  }
  if (row.sds_object_key) await deps.objectStore.delete(row.sds_object_key).catch(() => undefined);
  return getProduct(deps, actor, id);
}

export async function openSafetyDataSheet(
  deps: AppDeps,
  actor: Actor,
  id: number,
): Promise<{ name: string; body: Readable }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Product');
  const row = await findProductRow(deps.db, actor.firmId, id);
  if (!row?.sds_object_key) throw notFound('That safety data sheet');
  return { name: row.name, body: await deps.objectStore.get(row.sds_object_key) };
}
