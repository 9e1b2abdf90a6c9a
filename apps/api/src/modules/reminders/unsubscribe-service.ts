import { ForbiddenError } from '@casl/ability';
import {
  maskEmail,
  type MarketingSuppression,
  type MarketingSuppressionInput,
  type UnsubscribePreview,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { createToken, hashToken } from '../../lib/tokens.ts';
import {
  findSuppression,
  findUnsubscribeToken,
  insertSuppression,
  insertUnsubscribeToken,
  isSuppressed,
  listSuppressions,
  markUnsubscribeTokenUsed,
} from './unsubscribe-dal.ts';

// PECR 2003 regulation 22: marketing e-mail only to those who have not refused it, and every message gives a
// simple, free means to refuse. The link's token does only that, for one address at one firm, with no sign-in.

/**
 * A fresh unsubscribe link for one marketing e-mail, written in the sender's transaction (so the link exists
 * exactly when the e-mail does).
 */
export async function createUnsubscribeLink(
  trx: Knex.Transaction,
  firmId: number,
  email: string,
  appOrigin: string,
): Promise<string> {
  const { token, tokenHash } = createToken();
  await insertUnsubscribeToken(trx, { firmId, tokenHash, email });
  return new URL(`/unsubscribe/${token}`, appOrigin).toString();
}

/** Whether the firm may send this address marketing: false once it is on the firm's suppression list. */
export async function mayMarketTo(db: Knex | Knex.Transaction, firmId: number, email: string): Promise<boolean> {
  return !(await isSuppressed(db, firmId, email));
}

export async function previewUnsubscribe(deps: AppDeps, token: string): Promise<UnsubscribePreview> {
  const found = await findUnsubscribeToken(deps.db, hashToken(token));
  if (!found) throw notFound('That unsubscribe link');
  return {
    firmName: found.firmName,
    maskedEmail: maskEmail(found.email),
    unsubscribed: await isSuppressed(deps.db, found.firmId, found.email),
  };
}

/** Puts the link's address on its firm's suppression list; doing it again changes nothing and says the same. */
export async function unsubscribe(deps: AppDeps, token: string): Promise<UnsubscribePreview> {
  const found = await findUnsubscribeToken(deps.db, hashToken(token));
  if (!found) throw notFound('That unsubscribe link');
  await deps.db.transaction(async (trx) => {
    await insertSuppression(trx, found.firmId, found.email, 'unsubscribe_link');
    await markUnsubscribeTokenUsed(trx, found.firmId, found.id, deps.clock.now());
  });
  return { firmName: found.firmName, maskedEmail: maskEmail(found.email), unsubscribed: true };
}

/** The firm's suppression list, for the office (those who manage reminder settings). */
export async function listMarketingSuppressions(deps: AppDeps, actor: Actor): Promise<MarketingSuppression[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'ReminderSettings');
  return listSuppressions(deps.db, actor.firmId);
}

/**
 * The office adds an address a customer asked, by phone or letter, not to be sent offers. Adding one already on
 * the list changes nothing and answers the entry as it stands (how it got there first is kept).
 */
export async function addMarketingSuppression(
  deps: AppDeps,
  actor: Actor,
  input: MarketingSuppressionInput,
): Promise<MarketingSuppression> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'ReminderSettings');
  await insertSuppression(deps.db, actor.firmId, input.email, 'office');
  const added = await findSuppression(deps.db, actor.firmId, input.email);
  if (!added) throw new Error('suppression not found after insert');
  return added;
}
