import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3';
import knexFactory, { type Knex } from 'knex';
import { writeTag, type Ack } from './steady-load.ts';

export function connectDatabase(env: Record<string, string>): Knex {
  return knexFactory({
    client: 'mysql2',
    connection: {
      host: env.DATABASE_HOST,
      port: Number(env.DATABASE_PORT),
      user: env.DATABASE_USER,
      password: env.DATABASE_PASSWORD,
      database: env.DATABASE_NAME,
      timezone: 'Z',
      connectTimeout: 3000,
    },
    pool: { min: 0, max: 4 },
    acquireConnectionTimeout: 5000,
  });
}

export interface AckCheck {
  acknowledged: number;
  keysTried: number;
  /** Acknowledged writes whose group or movements are not in the ledger as answered. */
  missing: string[];
  /** Keys whose work was applied more than once. */
  duplicated: string[];
  /** Acknowledged by a replay of the stored answer (the first attempt had committed). */
  replayed: number;
}

/** The client's log of acknowledged writes against the ledger: each there, as answered, exactly once. */
export async function checkAcks(db: Knex, firmId: number, acks: Ack[], keysTried: Set<string>): Promise<AckCheck> {
  const rows = (await db('stock_movements')
    .where({ firm_id: firmId })
    .andWhere((q) => q.where('reason', 'like', 'drill:%').orWhere('reference', 'like', 'drill:%'))
    .select('id', 'group_id', 'reason', 'reference')) as {
    id: number;
    group_id: string;
    reason: string | null;
    reference: string | null;
  }[];
  const groupsByTag = new Map<string, Set<string>>();
  const idsByGroup = new Map<string, Set<number>>();
  for (const row of rows) {
    const tag = row.reference?.startsWith('drill:') ? row.reference : (row.reason ?? '');
    const groups = groupsByTag.get(tag) ?? new Set<string>();
    groups.add(row.group_id);
    groupsByTag.set(tag, groups);
    const ids = idsByGroup.get(row.group_id) ?? new Set<number>();
    ids.add(Number(row.id));
    idsByGroup.set(row.group_id, ids);
  }
  const missing: string[] = [];
  for (const ack of acks) {
    const groups = groupsByTag.get(writeTag(ack.key));
    const ids = idsByGroup.get(ack.groupId);
    if (!groups?.has(ack.groupId) || !ids || ack.movementIds.some((id) => !ids.has(id)))
      missing.push(`${ack.kind} ${ack.key}`);
  }
  const duplicated = [...keysTried].filter((key) => (groupsByTag.get(writeTag(key))?.size ?? 0) > 1);
  return {
    acknowledged: acks.length,
    keysTried: keysTried.size,
    missing,
    duplicated,
    replayed: acks.filter((a) => a.attempt > 1).length,
  };
}

export interface BalanceCheck {
  balances: number;
  mismatched: string[];
}

/**
 * Every balance row against the sum of its ledger, for every firm. Both are read in one transaction (one InnoDB
 * snapshot), so a write landing between the two reads under load is not taken for a mismatch.
 */
export async function checkBalances(db: Knex): Promise<BalanceCheck> {
  return db.transaction((trx) => readBalances(trx));
}

async function readBalances(db: Knex.Transaction): Promise<BalanceCheck> {
  const balances = (await db('stock_balances').select('firm_id', 'location_id', 'batch_id', 'quantity')) as {
    firm_id: number;
    location_id: number;
    batch_id: number;
    quantity: number;
  }[];
  const sums = (await db('stock_movements')
    .groupBy('firm_id', 'location_id', 'batch_id')
    .select('firm_id', 'location_id', 'batch_id')
    .sum({ total: 'quantity_delta' })) as {
    firm_id: number;
    location_id: number;
    batch_id: number;
    total: string | number;
  }[];
  const key = (r: { firm_id: number; location_id: number; batch_id: number }) =>
    `${r.firm_id}/${r.location_id}/${r.batch_id}`;
  const ledger = new Map(sums.map((s) => [key(s), Number(s.total)]));
  const mismatched: string[] = [];
  for (const b of balances) {
    const sum = ledger.get(key(b)) ?? 0;
    if (sum !== Number(b.quantity)) mismatched.push(`${key(b)}: balance ${b.quantity}, ledger ${sum}`);
    ledger.delete(key(b));
  }
  for (const [k, sum] of ledger) if (sum !== 0) mismatched.push(`${k}: no balance row, ledger ${sum}`);
  return { balances: balances.length, mismatched };
}

/** How many times the SMTP catcher received each stored e-mail (the worker stamps its id in a header). */
export function outboxCounts(outboxDir: string): Map<number, number> {
  const counts = new Map<number, number>();
  for (const name of readdirSync(outboxDir)) {
    if (!name.endsWith('.eml')) continue;
    const raw = readFileSync(join(outboxDir, name), 'utf8');
    const head = raw.slice(0, raw.search(/\r?\n\r?\n/) + 1 || raw.length);
    const match = /^X-Heatfleet-Email-Id:\s*(\d+)/im.exec(head);
    if (match?.[1] === undefined) continue;
    const id = Number(match[1]);
    counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  return counts;
}

export interface EmailState {
  id: number;
  purpose: string;
  to: string;
  attempts: number;
  createdAt: number;
  sentAt: number | null;
  caught: number;
}

export async function emailStates(
  db: Knex,
  outboxDir: string,
  where: (q: Knex.QueryBuilder) => void = () => undefined,
): Promise<EmailState[]> {
  const counts = outboxCounts(outboxDir);
  const query = db('emails').select('id', 'purpose', 'to_address', 'attempts', 'created_at', 'sent_at').orderBy('id');
  where(query);
  const rows = (await query) as {
    id: number;
    purpose: string;
    to_address: string;
    attempts: number;
    created_at: Date;
    sent_at: Date | null;
  }[];
  return rows.map((r) => ({
    id: r.id,
    purpose: r.purpose,
    to: r.to_address,
    attempts: r.attempts,
    createdAt: r.created_at.getTime(),
    sentAt: r.sent_at?.getTime() ?? null,
    caught: counts.get(r.id) ?? 0,
  }));
}

export interface FileCheck {
  rows: number;
  missing: string[];
}

/** Every photo row and every product's data sheet against the bucket: no row may point at a missing file. */
export async function checkStoredFiles(db: Knex, env: Record<string, string>): Promise<FileCheck> {
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID ?? '', secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? '' },
  });
  const photoKeys = ((await db('photos').select('object_key')) as { object_key: string }[]).map((r) => r.object_key);
  const sdsKeys = (
    (await db('products').whereNotNull('sds_object_key').select('sds_object_key')) as { sds_object_key: string }[]
  ).map((r) => r.sds_object_key);
  const missing: string[] = [];
  for (const key of [...photoKeys, ...sdsKeys]) {
    try {
      await client.send(new HeadObjectCommand({ Bucket: env.S3_BUCKET, Key: key }));
    } catch {
      missing.push(key);
    }
  }
  client.destroy();
  return { rows: photoKeys.length + sdsKeys.length, missing };
}
