import { type PublicQuote, type QuoteAcceptInput } from '@heatfleet/domain';
import type { AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { hashToken } from '../../lib/tokens.ts';
import { findFirmForMoney } from './job-lines-dal.ts';
import { publicQuoteAnswer } from './quote-answer.ts';
import { findQuoteByTokenHash, updateQuote } from './quote-dal.ts';
import { quotePdf } from './quote-pdf.ts';
import { assertOpen } from './quote-service.ts';

// The customer's link (no sign-in): the token is the only key. An unknown or expired link is a 404 that
// says nothing about whether a quote exists.

const LINK_GONE = 'This link has expired or is not valid. Ask the firm to send the quote again.';

async function quoteByToken(db: AppDeps['db'], token: string, now: Date, forUpdate = false) {
  const row = await findQuoteByTokenHash(db, hashToken(token), { forUpdate });
  if (!row || !row.token_expires_at || new Date(row.token_expires_at) <= now) throw notFound(LINK_GONE);
  return row;
}

export async function viewQuoteByLink(deps: AppDeps, token: string): Promise<PublicQuote> {
  const now = deps.clock.now();
  return publicQuoteAnswer(deps.db, await quoteByToken(deps.db, token, now), now);
}

export async function quotePdfByLink(deps: AppDeps, token: string): Promise<{ pdf: Buffer; name: string }> {
  const now = deps.clock.now();
  const row = await quoteByToken(deps.db, token, now);
  const firm = (await findFirmForMoney(deps.db, row.firm_id))!;
  const q = await publicQuoteAnswer(deps.db, row, now);
  return { pdf: await quotePdf(q, firm.time_zone, null), name: `quote-${q.number}.pdf` };
}

/**
 * The customer accepts with their name and a tick; whether they asked for the work within the 14-day
 * cancellation period (Consumer Contracts Regulations 2013, regulation 36) is recorded with it.
 */
export async function acceptQuoteByLink(deps: AppDeps, token: string, input: QuoteAcceptInput): Promise<PublicQuote> {
  const now = deps.clock.now();
  return deps.db.transaction(async (trx) => {
    const row = await quoteByToken(trx, token, now, true);
    const firm = (await findFirmForMoney(trx, row.firm_id))!;
    assertOpen(row, firm.time_zone, now);
    await updateQuote(trx, row.firm_id, row.id, {
      status: 'accepted',
      accepted_name: input.name,
      accepted_at: now,
      accepted_via: 'link',
      express_request: input.expressRequest,
    });
    return publicQuoteAnswer(trx, (await findQuoteByTokenHash(trx, row.token_hash!))!, now);
  });
}

export async function declineQuoteByLink(deps: AppDeps, token: string, reason: string | null): Promise<PublicQuote> {
  const now = deps.clock.now();
  return deps.db.transaction(async (trx) => {
    const row = await quoteByToken(trx, token, now, true);
    const firm = (await findFirmForMoney(trx, row.firm_id))!;
    assertOpen(row, firm.time_zone, now);
    await updateQuote(trx, row.firm_id, row.id, { status: 'declined', declined_at: now, decline_reason: reason });
    return publicQuoteAnswer(trx, (await findQuoteByTokenHash(trx, row.token_hash!))!, now);
  });
}
