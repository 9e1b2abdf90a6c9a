import { randomUUID } from 'node:crypto';
import { appendFileSync, writeFileSync } from 'node:fs';
import { setTimeout as sleep } from 'node:timers/promises';
import type { ApiClient, Answer } from './api-client.ts';

export interface Sample {
  client: string;
  op: string;
  start: number;
  end: number;
  status: number;
  error?: string;
}

export type WriteKind = 'receipt' | 'transfer' | 'usage';

/** A write the API answered 201 to: the client holds it as done, so the database must hold it too. */
export interface Ack {
  kind: WriteKind;
  key: string;
  groupId: string;
  movementIds: number[];
  at: number;
  /** Answered from the stored key row (an earlier attempt had committed, its answer was lost). */
  attempt: number;
}

/** The text each write carries in its reason or reference, so the ledger can be searched per key. */
export function writeTag(key: string): string {
  return `drill:${key}`;
}

export interface LoadPlaces {
  depotId: number;
  vanId: number;
  productIds: number[];
}

interface PendingWrite {
  key: string;
  attempt: number;
  body?: unknown;
}

/** A served answer, good or refused by a rule (409 out of stock): the API did its job. */
export function answered(status: number): boolean {
  return status >= 200 && status < 500;
}

/**
 * A few signed-in people working steadily: reads of the pages they would open, and writes with an
 * Idempotency-Key. A write that got no answer (or a 5xx) is retried with the same key, as a careful
 * client would; every 201 is logged to the acks file as it comes.
 */
export class SteadyLoad {
  readonly samples: Sample[] = [];
  readonly acks: Ack[] = [];
  /** Every key sent, acknowledged or not: the ledger must hold each at most once. */
  readonly keysTried = new Set<string>();
  private running = false;
  private loops: Promise<void>[] = [];
  private lotCounter = 0;

  constructor(
    private readonly places: LoadPlaces,
    private readonly acksFile: string,
    private readonly pauseMs = 150,
  ) {
    writeFileSync(acksFile, '');
  }

  start(people: { stores: ApiClient; engineer: ApiClient; owner: ApiClient }): void {
    this.running = true;
    const { stores, engineer, owner } = people;
    const product = (n: number) => this.places.productIds[n % this.places.productIds.length]!;
    this.loops = [
      this.loop(stores, [
        (c) => this.read(c, '/api/stock'),
        (c, n) =>
          this.write(c, 'receipt', '/api/stock/receipts', (key) => ({
            locationId: this.places.depotId,
            reference: writeTag(key),
            lines: [
              { productId: product(n), lotNumber: `DRILL-${++this.lotCounter}`, expiresOn: '2029-06-30', quantity: 4 },
            ],
          })),
        (c) => this.read(c, '/api/stock/movements'),
        (c, n) =>
          this.write(c, 'transfer', '/api/stock/transfers', (key) => ({
            fromLocationId: this.places.depotId,
            toLocationId: this.places.vanId,
            lines: [{ productId: product(n), quantity: 2 }],
            note: writeTag(key),
          })),
      ]),
      this.loop(engineer, [
        (c) => this.read(c, '/api/me/van/stock'),
        (c, n) =>
          this.write(c, 'usage', '/api/stock/usages', (key) => ({
            locationId: this.places.vanId,
            productId: product(n),
            quantity: 1,
            reason: writeTag(key),
          })),
        (c) => this.read(c, '/api/kits'),
      ]),
      this.loop(owner, [
        (c) => this.read(c, '/api/me'),
        (c) => this.read(c, '/api/kit-items'),
        (c) => this.read(c, '/api/stock'),
      ]),
    ];
  }

  async stop(): Promise<void> {
    this.running = false;
    await Promise.all(this.loops);
  }

  private async loop(client: ApiClient, ops: ((client: ApiClient, n: number) => Promise<Answer>)[]): Promise<void> {
    let n = 0;
    while (this.running) {
      const op = ops[n % ops.length]!;
      const answer = await op(client, Math.floor(n / ops.length));
      n += 1;
      await sleep(answered(answer.status) ? this.pauseMs : this.pauseMs * 2);
    }
  }

  private record(client: ApiClient, op: string, start: number, answer: Answer): void {
    this.samples.push({
      client: client.label,
      op,
      start,
      end: start + answer.ms,
      status: answer.status,
      ...(answer.error !== undefined && { error: answer.error }),
    });
  }

  private async read(client: ApiClient, path: string): Promise<Answer> {
    const start = Date.now();
    const answer = await client.get(path);
    this.record(client, `GET ${path}`, start, answer);
    return answer;
  }

  private readonly pending = new Map<string, PendingWrite>();

  private async write(
    client: ApiClient,
    kind: WriteKind,
    path: string,
    body: (key: string) => unknown,
  ): Promise<Answer> {
    const slot = `${client.label} ${kind}`;
    // The same key and the same body again after a lost answer: a new body under an old key would be refused.
    const pending = this.pending.get(slot) ?? { key: randomUUID(), attempt: 0 };
    pending.attempt += 1;
    this.keysTried.add(pending.key);
    pending.body ??= body(pending.key);
    const payload = pending.body;
    const start = Date.now();
    const answer = await client.post(path, payload, { 'idempotency-key': pending.key });
    this.record(client, `POST ${path}`, start, answer);
    if (answer.status === 201) {
      const out = answer.body as { groupId: string; movements: { id: number }[] };
      const ack: Ack = {
        kind,
        key: pending.key,
        groupId: out.groupId,
        movementIds: out.movements.map((m) => Number(m.id)),
        at: Date.now(),
        attempt: pending.attempt,
      };
      this.acks.push(ack);
      appendFileSync(this.acksFile, `${JSON.stringify(ack)}\n`);
      this.pending.delete(slot);
    } else if (answer.status === 0 || answer.status >= 500) {
      if (pending.attempt < 20) this.pending.set(slot, pending);
      else this.pending.delete(slot);
    } else {
      this.pending.delete(slot);
    }
    return answer;
  }
}

/** Samples that started inside [from, to). */
export function samplesBetween(samples: Sample[], from: number, to: number): Sample[] {
  return samples.filter((s) => s.start >= from && s.start < to);
}
