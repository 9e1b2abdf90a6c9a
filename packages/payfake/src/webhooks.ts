import { createHmac } from 'node:crypto';
import type { StripeEvent } from './state.ts';

export interface WebhookOptions {
  url: string | null;
  secret: string;
  /** Waits before each retry; the hosted service retries for days, the fake for minutes. */
  retryDelaysMs: number[];
  log: (line: string) => void;
}

export interface Delivery {
  eventId: string;
  type: string;
  attempts: number;
  delivered: boolean;
  lastStatus: number | null;
}

/** The header the hosted service sends: `t=<unix seconds>,v1=<HMAC-SHA256 of "t.body" with the endpoint's secret>`. */
export function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

/**
 * Posts each event to the endpoint, signed, and retries a refusal or a network failure after each delay in turn.
 * Held events (hold()) wait until release(), which can send them in another order, as the hosted service may.
 */
export class WebhookSender {
  readonly deliveries = new Map<string, Delivery>();
  private held: StripeEvent[] | null = null;
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly inFlight = new Set<Promise<void>>();
  private closed = false;

  constructor(private readonly options: WebhookOptions) {}

  send(event: StripeEvent): void {
    if (this.options.url === null || this.closed) return;
    if (this.held !== null) {
      this.held.push(event);
      return;
    }
    const delivery: Delivery = { eventId: event.id, type: event.type, attempts: 0, delivered: false, lastStatus: null };
    this.deliveries.set(event.id, delivery);
    this.attempt(event, delivery);
  }

  hold(): void {
    this.held ??= [];
  }

  release(order: 'sent' | 'reverse' = 'sent'): void {
    const events = this.held ?? [];
    this.held = null;
    for (const event of order === 'reverse' ? [...events].reverse() : events) this.send(event);
  }

  /** Sends an event again, as the hosted service's "resend" does (a repeat the endpoint must ignore). */
  resend(event: StripeEvent): void {
    const delivery: Delivery = { eventId: event.id, type: event.type, attempts: 0, delivered: false, lastStatus: null };
    this.attempt(event, delivery);
  }

  /** Resolves when nothing is in flight or waiting to be retried. */
  async settled(): Promise<void> {
    while (this.inFlight.size > 0 || this.timers.size > 0) {
      await Promise.race([...this.inFlight, new Promise((resolve) => setTimeout(resolve, 20))]);
    }
  }

  close(): void {
    this.closed = true;
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
  }

  private attempt(event: StripeEvent, delivery: Delivery): void {
    const url = this.options.url;
    if (url === null || this.closed) return;
    const payload = JSON.stringify(event, null, 2);
    delivery.attempts += 1;
    const run = (async () => {
      let status: number | null;
      try {
        const res = await fetch(url, {
          method: 'POST',
          headers: {
            'Content-Type': 'application/json; charset=utf-8',
            'Stripe-Signature': signatureHeader(payload, this.options.secret),
            'User-Agent': 'Heatfleet-Payfake/1.0 (+webhooks)',
          },
          body: payload,
          signal: AbortSignal.timeout(10_000),
        });
        status = res.status;
        await res.arrayBuffer();
      } catch {
        status = null;
      }
      delivery.lastStatus = status;
      if (status !== null && status >= 200 && status < 300) {
        delivery.delivered = true;
        return;
      }
      const wait = this.options.retryDelaysMs[delivery.attempts - 1];
      // Only the last failure is told: while nothing listens (npm test's API-only phase) retries would flood the log.
      if (wait === undefined) {
        this.options.log(
          `webhook ${event.type} ${event.id}: gave up after ${delivery.attempts} attempts (last: ${status ?? 'no answer'})`,
        );
      }
      if (wait === undefined || this.closed) return;
      const timer = setTimeout(() => {
        this.timers.delete(timer);
        this.attempt(event, delivery);
      }, wait);
      timer.unref();
      this.timers.add(timer);
    })();
    this.inFlight.add(run);
    void run.finally(() => this.inFlight.delete(run));
  }
}
