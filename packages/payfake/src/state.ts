import { noSuch } from './errors.ts';
import { newId, nowSeconds } from './ids.ts';

/** One object as the hosted service answers it (`id`, `object`, then its own fields). */
export interface ApiObject {
  id: string;
  object: string;
  [field: string]: unknown;
}

export interface StripeEvent extends ApiObject {
  type: string;
  account?: string;
  data: { object: ApiObject; previous_attributes?: Record<string, unknown> };
}

/** The platform's own objects live under this key; each connected account's under its acct_ id. */
export const PLATFORM = 'platform';

/**
 * Everything the fake knows, kept per account (the Stripe-Account header picks the account): a connected
 * account's checkout sessions are not found with another account's header or the platform's.
 */
export class FakeState {
  private readonly byAccount = new Map<string, Map<string, ApiObject>>();
  /** Hosted pages are addressed by an object's id alone: which account holds it. */
  private readonly hostedOwner = new Map<string, string>();
  readonly events: StripeEvent[] = [];
  /** Where hosted pages are reached (set by the server once it listens). */
  publicUrl = '';

  constructor(private readonly onEvent: (event: StripeEvent) => void) {}

  private objects(account: string): Map<string, ApiObject> {
    let map = this.byAccount.get(account);
    if (!map) {
      map = new Map();
      this.byAccount.set(account, map);
    }
    return map;
  }

  put<T extends ApiObject>(account: string, object: T): T {
    this.objects(account).set(object.id, object);
    this.hostedOwner.set(object.id, account);
    return object;
  }

  find<T extends ApiObject>(account: string, id: string, objectName: string): T | undefined {
    const found = this.objects(account).get(id);
    return found?.object === objectName ? (found as T) : undefined;
  }

  get<T extends ApiObject>(account: string, id: string, objectName: string, param = 'id'): T {
    const found = this.find<T>(account, id, objectName);
    if (!found) throw noSuch(objectName, id, param);
    return found;
  }

  list<T extends ApiObject>(account: string, objectName: string, where: (object: T) => boolean = () => true): T[] {
    return [...this.objects(account).values()]
      .filter((object): object is T => object.object === objectName && where(object as T))
      .reverse();
  }

  /** For hosted pages: the account and object behind an id in a page's address. */
  locate<T extends ApiObject>(id: string, objectName: string): { account: string; object: T } | undefined {
    const account = this.hostedOwner.get(id);
    if (account === undefined) return undefined;
    const object = this.find<T>(account, id, objectName);
    return object ? { account, object } : undefined;
  }

  hasAccount(account: string): boolean {
    return this.find(PLATFORM, account, 'account') !== undefined;
  }

  /** Records an event and hands it to the webhook sender; a connected account's events name the account. */
  emit(account: string, type: string, object: ApiObject, previous?: Record<string, unknown>): StripeEvent {
    const event: StripeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: '2026-11-18.endive',
      created: nowSeconds(),
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
      ...(account === PLATFORM ? {} : { account }),
      data: { object: structuredClone(object), ...(previous ? { previous_attributes: previous } : {}) },
    };
    this.events.push(event);
    this.onEvent(event);
    return event;
  }
}
