import { ForbiddenError } from '@casl/ability';
import type { PaymentAccount } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { callPaymentService, paymentClient } from './payment-client.ts';
import {
  findPaymentAccount,
  deletePaymentAccount,
  insertPaymentAccount,
  setPaymentAccountStatus,
  type PaymentAccountRow,
} from './payment-dal.ts';

function accountOf(row: PaymentAccountRow | undefined): PaymentAccount {
  return {
    connected: row !== undefined,
    chargesEnabled: Boolean(row?.charges_enabled),
    detailsSubmitted: Boolean(row?.details_submitted),
  };
}

/**
 * The firm's payment account as the Settings page shows it, asked of the service each time (the person may have
 * just come back from its onboarding page, ahead of the account.updated webhook). An account the service no longer
 * knows (disconnected there, or a restarted local stand-in) is forgotten here, so the Owner can connect again.
 */
export async function getPaymentAccount(deps: AppDeps, actor: Actor): Promise<PaymentAccount> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'PaymentAccount');
  const row = await findPaymentAccount(deps.db, actor.firmId);
  if (!row) return accountOf(row);
  const stripe = paymentClient(deps.env);
  const account = await callPaymentService(deps.logger, 'accounts.retrieve', () =>
    stripe.accounts.retrieve(row.provider_account_id).catch((error: unknown) => {
      const e = error as { statusCode?: number; code?: string };
      if (e.statusCode === 403 || e.statusCode === 404 || e.code === 'resource_missing') return null;
      throw error;
    }),
  );
  if (account === null) {
    await deletePaymentAccount(deps.db, actor.firmId);
    return accountOf(undefined);
  }
  const status = { chargesEnabled: account.charges_enabled, detailsSubmitted: account.details_submitted };
  await setPaymentAccountStatus(deps.db, actor.firmId, status, deps.clock.now());
  return { connected: true, ...status };
}

/**
 * The link to the service's onboarding page for the firm's own connected account (made the first time, then
 * reused): the customers' money lands in the firm's account, never Heatfleet's.
 */
export async function startOnboarding(deps: AppDeps, actor: Actor): Promise<{ url: string }> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'PaymentAccount');
  const stripe = paymentClient(deps.env);
  let row = await findPaymentAccount(deps.db, actor.firmId);
  if (!row) {
    const firm = await findFirm(deps.db, actor.firmId);
    if (!firm) throw notFound('That firm');
    const account = await callPaymentService(deps.logger, 'accounts.create', () =>
      stripe.accounts.create(
        {
          type: 'standard',
          country: 'GB',
          business_profile: { name: firm.name },
          metadata: { firmId: String(firm.id) },
        },
        // One account per firm even if the owner presses twice at once.
        { idempotencyKey: `heatfleet-firm-account-${firm.id}` },
      ),
    );
    await insertPaymentAccount(deps.db, actor.firmId, account.id).catch(async (error: unknown) => {
      if ((error as { code?: string }).code !== 'ER_DUP_ENTRY') throw error;
    });
    row = await findPaymentAccount(deps.db, actor.firmId);
    if (!row) throw notFound('The payment account');
  }
  const accountId = row.provider_account_id;
  const settings = new URL('/settings/payments', deps.env.APP_ORIGIN);
  const link = await callPaymentService(deps.logger, 'accountLinks.create', () =>
    stripe.accountLinks.create({
      account: accountId,
      type: 'account_onboarding',
      return_url: `${settings.toString()}?returned=1`,
      refresh_url: `${settings.toString()}?expired=1`,
    }),
  );
  return { url: link.url };
}
