import { randomUUID } from 'node:crypto';
import { ForbiddenError } from '@casl/ability';
import {
  addDays,
  calendarDateIn,
  priceLines,
  type MoneyLineInput,
  type Quote,
  type QuoteInput,
  type QuotePhoneAcceptInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notFound } from '../../lib/http-error.ts';
import { createToken } from '../../lib/tokens.ts';
import { requireJob } from '../jobs/job-access.ts';
import { decodeSignaturePng } from '../jobs/visit-service.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { findFirmForMoney, findJobParties } from './job-lines-dal.ts';
import { deleteLines, insertLines } from './money-line-dal.ts';
import { findMoneySettings, takeNextNumber } from './money-settings-dal.ts';
import { publicQuoteAnswer, quoteAnswer, quoteExpired } from './quote-answer.ts';
import { findQuote, insertQuote, listQuotes, updateQuote, type QuoteRow } from './quote-dal.ts';
import { quotePdf } from './quote-pdf.ts';

export const ANSWERED_MESSAGE = 'This quote has been answered; it can no longer change. Make a new quote instead.';

async function writeQuoteLines(trx: Knex.Transaction, firmId: number, quoteId: number, lines: MoneyLineInput[]) {
  const settings = await findMoneySettings(trx, firmId);
  const priced = priceLines(
    lines.map((l) => ({ ...l, vatRateBp: settings.vatRateBp })),
    settings.vatRegistered,
  );
  await deleteLines(trx, 'quote_lines', firmId, quoteId);
  await insertLines(
    trx,
    'quote_lines',
    firmId,
    quoteId,
    priced.lines.map((l, i) => ({
      ...l,
      kind: lines[i]!.kind,
      priceItemId: lines[i]!.priceItemId,
      productId: lines[i]!.productId,
    })),
  );
  return { ...priced.totals, vatRegistered: settings.vatRegistered };
}

export async function listQuotesFor(deps: AppDeps, actor: Actor, jobId?: number): Promise<Quote[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Quote');
  const now = deps.clock.now();
  return Promise.all(
    (await listQuotes(deps.db, actor.firmId, { jobId })).map((r) => quoteAnswer(deps.db, actor.firmId, r, now)),
  );
}

async function requireQuote(
  db: Knex | Knex.Transaction,
  firmId: number,
  id: number,
  forUpdate = false,
): Promise<QuoteRow> {
  const row = await findQuote(db, firmId, id, { forUpdate });
  if (!row) throw notFound('That quote');
  return row;
}

export async function getQuote(deps: AppDeps, actor: Actor, id: number): Promise<Quote> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Quote');
  return quoteAnswer(deps.db, actor.firmId, await requireQuote(deps.db, actor.firmId, id), deps.clock.now());
}

/** A quote for a job with its own number from the firm's quote sequence; valid for the firm's days unless given. */
export async function createQuote(deps: AppDeps, actor: Actor, input: QuoteInput): Promise<Quote> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Quote');
  return deps.db.transaction(async (trx) => {
    const job = await requireJob(trx, actor.firmId, input.jobId);
    if (job.status === 'cancelled') throw conflict('This job was cancelled; it cannot be quoted.');
    const settings = await findMoneySettings(trx, actor.firmId);
    const firm = (await findFirmForMoney(trx, actor.firmId))!;
    const today = calendarDateIn(deps.clock.now(), firm.time_zone);
    const validUntil = input.validUntil ?? addDays(today, settings.quoteValidityDays);
    if (validUntil < today)
      throw new HttpError(422, 'The quote must be valid until today or later.', 'ValidationFailed', [
        { path: 'validUntil', message: 'In the past.' },
      ]);
    const id = await insertQuote(trx, {
      firm_id: actor.firmId,
      job_id: input.jobId,
      number: await takeNextNumber(trx, actor.firmId, 'quote'),
      status: 'draft',
      valid_until: validUntil,
      vat_registered: settings.vatRegistered,
      notes: input.notes ?? null,
      net_pence: 0,
      vat_pence: 0,
      total_pence: 0,
      created_by_user_id: actor.userId,
    });
    const totals = await writeQuoteLines(trx, actor.firmId, id, input.lines);
    await updateQuote(trx, actor.firmId, id, {
      net_pence: totals.netPence,
      vat_pence: totals.vatPence,
      total_pence: totals.totalPence,
    });
    return quoteAnswer(trx, actor.firmId, (await findQuote(trx, actor.firmId, id))!, deps.clock.now());
  });
}

export async function changeQuote(
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: Pick<QuoteInput, 'lines' | 'validUntil' | 'notes'>,
): Promise<Quote> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Quote');
  return deps.db.transaction(async (trx) => {
    const row = await requireQuote(trx, actor.firmId, id, true);
    if (row.status === 'accepted' || row.status === 'declined') throw conflict(ANSWERED_MESSAGE);
    const totals = await writeQuoteLines(trx, actor.firmId, id, input.lines);
    await updateQuote(trx, actor.firmId, id, {
      net_pence: totals.netPence,
      vat_pence: totals.vatPence,
      total_pence: totals.totalPence,
      vat_registered: totals.vatRegistered,
      ...(input.validUntil ? { valid_until: input.validUntil } : {}),
      notes: input.notes ?? null,
    });
    return quoteAnswer(trx, actor.firmId, (await findQuote(trx, actor.firmId, id))!, deps.clock.now());
  });
}

/** The link's token lives until the end of the validity day (plus a day's slack for time zones). */
function tokenExpiry(validUntil: string): Date {
  return new Date(Date.parse(`${addDays(validUntil, 2)}T00:00:00Z`));
}

/**
 * E-mails the quote (PDF attached) with a new link to accept or decline it: a 32-byte single-purpose token,
 * only its SHA-256 kept, expiring after the validity date; sending again replaces the link.
 */
export async function sendQuote(deps: AppDeps, actor: Actor, id: number): Promise<Quote> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Quote');
  let emailId: number | null = null;
  const answer = await deps.db.transaction(async (trx) => {
    const row = await requireQuote(trx, actor.firmId, id, true);
    if (row.status === 'accepted' || row.status === 'declined') throw conflict(ANSWERED_MESSAGE);
    const parties = (await findJobParties(trx, actor.firmId, row.job_id))!;
    if (quoteExpired(row, parties.timeZone, deps.clock.now()))
      throw conflict('This quote has expired: change its validity date first.');
    if (!parties.customerEmail)
      throw conflict('The customer has no e-mail address: add one, or take their acceptance on the phone.');
    const { token, tokenHash } = createToken();
    const link = new URL(`/q/${token}`, deps.env.APP_ORIGIN).toString();
    await updateQuote(trx, actor.firmId, id, {
      token_hash: tokenHash,
      token_expires_at: tokenExpiry(row.valid_until),
      status: 'sent',
      sent_at: deps.clock.now(),
    });
    const updated = (await findQuote(trx, actor.firmId, id))!;
    const pub = await publicQuoteAnswer(trx, updated, deps.clock.now());
    const key = `firms/${actor.firmId}/quotes/quote-${id}-${randomUUID()}.pdf`;
    await deps.objectStore.put(key, await quotePdf(pub, parties.timeZone, link), 'application/pdf');
    emailId = await insertEmail(trx, {
      firmId: actor.firmId,
      to: parties.customerEmail,
      subject: `Quote ${pub.number} from ${pub.firmName}`,
      text:
        [
          `Dear ${pub.customerName},`,
          `Please find attached quote ${pub.number} from ${pub.firmName} for work on your heating system.`,
          `You can read it, and accept or decline it, here: ${link}`,
          'The quote includes your right to cancel and a cancellation form.',
        ].join('\n\n') + '\n',
      html: null,
      purpose: 'quote',
      attachment: { key, filename: `quote-${pub.number}.pdf` },
    });
    return quoteAnswer(trx, actor.firmId, updated, deps.clock.now());
  });
  if (emailId !== null) await deps.mailQueue.notify([emailId]);
  return answer;
}

/**
 * Acceptance taken on the engineer's phone: the customer's name, tick, express request (Consumer Contracts
 * Regulations 2013, regulation 36) and drawn signature (a PNG, checked from its bytes, kept in the store).
 */
export async function acceptQuoteOnPhone(
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: QuotePhoneAcceptInput,
): Promise<Quote> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Quote');
  const png = decodeSignaturePng(input.imagePngDataUrl);
  const key = `firms/${actor.firmId}/quotes/quote-${id}-signature-${randomUUID()}.png`;
  return deps.db.transaction(async (trx) => {
    const row = await requireQuote(trx, actor.firmId, id, true);
    const parties = (await findJobParties(trx, actor.firmId, row.job_id))!;
    assertOpen(row, parties.timeZone, deps.clock.now());
    await deps.objectStore.put(key, png, 'image/png');
    await updateQuote(trx, actor.firmId, id, {
      status: 'accepted',
      accepted_name: input.name,
      accepted_at: deps.clock.now(),
      accepted_via: 'phone',
      express_request: input.expressRequest,
      signature_key: key,
    });
    return quoteAnswer(trx, actor.firmId, (await findQuote(trx, actor.firmId, id))!, deps.clock.now());
  });
}

/** Only a quote not yet answered and not expired may be accepted or declined. */
export function assertOpen(row: QuoteRow, timeZone: string, now: Date): void {
  if (row.status === 'accepted') throw conflict('This quote has already been accepted.');
  if (row.status === 'declined') throw conflict('This quote has been declined.');
  if (quoteExpired(row, timeZone, now)) throw conflict('This quote has expired. Ask the firm for a new one.');
}

export async function quotePdfFor(deps: AppDeps, actor: Actor, id: number): Promise<Buffer> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Quote');
  const row = await requireQuote(deps.db, actor.firmId, id);
  const firm = (await findFirmForMoney(deps.db, actor.firmId))!;
  return quotePdf(await publicQuoteAnswer(deps.db, row, deps.clock.now()), firm.time_zone, null);
}
