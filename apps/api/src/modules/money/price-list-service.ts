import { ForbiddenError } from '@casl/ability';
import {
  VAT_ROUNDING_RULE,
  type MoneySettings,
  type MoneySettingsInput,
  type PriceItem,
  type PriceItemInput,
  type PriceListResponse,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound, ruleBroken } from '../../lib/http-error.ts';
import { findMoneySettings, saveMoneySettings, type MoneySettingsRow } from './money-settings-dal.ts';
import {
  findPriceItem,
  insertPriceItem,
  listPriceItems,
  productBelongsToFirm,
  updatePriceItem,
} from './price-list-dal.ts';

export function settingsAnswer(s: MoneySettingsRow): MoneySettings {
  const { saved, ...rest } = s;
  return { ...rest, saved, roundingRule: VAT_ROUNDING_RULE };
}

export async function getPriceList(deps: AppDeps, actor: Actor): Promise<PriceListResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'PriceList');
  const [settings, items] = await Promise.all([
    findMoneySettings(deps.db, actor.firmId),
    listPriceItems(deps.db, actor.firmId),
  ]);
  return { settings: settingsAnswer(settings), items };
}

export async function putMoneySettings(deps: AppDeps, actor: Actor, input: MoneySettingsInput): Promise<MoneySettings> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'PriceList');
  await saveMoneySettings(deps.db, actor.firmId, {
    vatRegistered: input.vatRegistered,
    vatNumber: input.vatRegistered ? (input.vatNumber ?? null) : null,
    vatRateBp: input.vatRateBp,
    paymentTermsDays: input.paymentTermsDays,
    quoteValidityDays: input.quoteValidityDays,
    firstReminderDays: input.firstReminderDays,
    secondReminderDays: input.secondReminderDays,
    invoiceOnCompletion: input.invoiceOnCompletion,
  });
  return settingsAnswer(await findMoneySettings(deps.db, actor.firmId));
}

async function checkProduct(deps: AppDeps, actor: Actor, input: PriceItemInput) {
  if (
    input.kind === 'chemical' &&
    input.productId &&
    !(await productBelongsToFirm(deps.db, actor.firmId, input.productId))
  )
    throw ruleBroken('That product is not in your stock list.', [
      { path: 'productId', message: 'Choose one of your products.' },
    ]);
}

export async function createPriceItem(deps: AppDeps, actor: Actor, input: PriceItemInput): Promise<PriceItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'PriceList');
  await checkProduct(deps, actor, input);
  const id = await insertPriceItem(deps.db, actor.firmId, input);
  return (await findPriceItem(deps.db, actor.firmId, id))!;
}

/** Changing a price changes what later quotes and invoices use; what was quoted or invoiced keeps its lines. */
export async function changePriceItem(
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: PriceItemInput,
): Promise<PriceItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'PriceList');
  if (!(await findPriceItem(deps.db, actor.firmId, id))) throw notFound('That price');
  await checkProduct(deps, actor, input);
  await updatePriceItem(deps.db, actor.firmId, id, input);
  return (await findPriceItem(deps.db, actor.firmId, id))!;
}
