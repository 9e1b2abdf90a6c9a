import { ApiError, invalidParam } from './errors.ts';
import { newId, nowSeconds } from './ids.ts';
import { esc, messagePage, page } from './pages.ts';
import {
  metadataOf,
  optionalObject,
  optionalString,
  requiredString,
  type ApiRoute,
  type PageRoute,
} from './routing.ts';
import { PLATFORM, type ApiObject } from './state.ts';

interface AccountLink extends ApiObject {
  account: string;
  return_url: string;
  refresh_url: string;
  expires_at: number;
  used: boolean;
}

const LINK_LIFETIME_SECONDS = 300;

/** Connected accounts (each firm's own), their onboarding links and the onboarding page. */
export const connectRoutes: ApiRoute[] = [
  {
    method: 'POST',
    pattern: /^\/v1\/accounts$/,
    platformOnly: true,
    handle: ({ body, state }) => {
      const type = optionalString(body, 'type') ?? 'standard';
      if (!['standard', 'express', 'custom'].includes(type)) {
        throw invalidParam('type', `Invalid type: must be one of standard, express, or custom`);
      }
      const profile = optionalObject(body, 'business_profile') ?? {};
      return state.put(PLATFORM, {
        id: newId('acct', 16),
        object: 'account',
        type,
        country: optionalString(body, 'country') ?? 'GB',
        default_currency: 'gbp',
        email: optionalString(body, 'email') ?? null,
        business_profile: { name: optionalString(profile, 'name') ?? null },
        charges_enabled: false,
        payouts_enabled: false,
        details_submitted: false,
        requirements: { currently_due: ['external_account', 'tos_acceptance.date'], disabled_reason: null },
        metadata: metadataOf(body),
        created: nowSeconds(),
      });
    },
  },
  {
    method: 'GET',
    pattern: /^\/v1\/accounts\/([^/]+)$/,
    platformOnly: true,
    handle: ({ params, state }) => state.get(PLATFORM, params[0]!, 'account', 'account'),
  },
  {
    method: 'POST',
    pattern: /^\/v1\/account_links$/,
    platformOnly: true,
    handle: ({ body, state, config }) => {
      const account = requiredString(body, 'account');
      state.get(PLATFORM, account, 'account', 'account');
      const type = requiredString(body, 'type');
      if (type !== 'account_onboarding' && type !== 'account_update') {
        throw invalidParam('type', 'Invalid type: must be one of account_onboarding or account_update');
      }
      const link: AccountLink = state.put(PLATFORM, {
        id: newId('acctlink'),
        object: 'account_link_record',
        account,
        return_url: requiredString(body, 'return_url'),
        refresh_url: requiredString(body, 'refresh_url'),
        expires_at: nowSeconds() + LINK_LIFETIME_SECONDS,
        used: false,
      });
      return {
        object: 'account_link',
        created: nowSeconds(),
        expires_at: link.expires_at,
        url: `${config.publicUrl}/setup/${link.id}`,
      };
    },
  },
];

export const connectPages: PageRoute[] = [
  {
    pattern: /^\/setup\/([^/]+)$/,
    handle: ({ method, params, state }) => {
      const found = state.locate<AccountLink>(params[0]!, 'account_link_record');
      if (!found) return { status: 404, html: messagePage('Link not found', 'This set-up link does not exist.') };
      const link = found.object;
      // Like the hosted service: a used or expired link sends the person to refresh_url for a new one.
      if (link.used || link.expires_at < nowSeconds()) return { redirect: link.refresh_url };
      const account = state.get<ApiObject>(PLATFORM, link.account, 'account');
      if (method === 'POST') {
        link.used = true;
        const previous = {
          charges_enabled: account.charges_enabled,
          payouts_enabled: account.payouts_enabled,
          details_submitted: account.details_submitted,
        };
        Object.assign(account, {
          charges_enabled: true,
          payouts_enabled: true,
          details_submitted: true,
          requirements: { currently_due: [], disabled_reason: null },
        });
        state.emit(account.id, 'account.updated', account, previous);
        return { redirect: link.return_url };
      }
      const name = (account.business_profile as { name: string | null }).name ?? 'your business';
      return {
        html: page(
          'Set up payments',
          `<h1>Set up payments for ${esc(name)}</h1>
<p>Tell us where to pay the money your customers pay you.</p>
<form method="post">
<label for="sort_code">Sort code</label><input id="sort_code" name="sort_code" inputmode="numeric" value="10-88-00">
<label for="account_number">Account number</label><input id="account_number" name="account_number" inputmode="numeric" value="00012345">
<button type="submit">Agree and finish set-up</button>
</form>
<a class="button secondary" href="${esc(link.refresh_url)}">Not now</a>`,
        ),
      };
    },
  },
];

export function assertChargesEnabled(account: ApiObject | undefined): void {
  if (account !== undefined && account.charges_enabled !== true) {
    throw new ApiError(
      400,
      'invalid_request_error',
      'This account cannot currently make charges: it has not finished onboarding.',
      'account_invalid',
    );
  }
}
