import { mkdirSync } from 'node:fs';
import { startMailCatcher, type MailCatcher } from './mail-catcher.ts';
import { startMariadb, stopMariadb, type MariadbInstance } from './mariadb.ts';
import { startObjectStore, type ObjectStore } from './object-store.ts';
import { startPayfake, type Payfake } from '@heatfleet/payfake';
import type { Profile } from './profiles.ts';
import { startRedis, stopRedis, type RedisInstance } from './redis.ts';
import { payfakeSecretKey, payfakeWebhookSecret, payfakeWebhookUrl } from './stack-env.ts';

export interface Services {
  mariadb: MariadbInstance;
  redis: RedisInstance | null;
  mail: MailCatcher | null;
  objectStore: ObjectStore | null;
  payfake: Payfake | null;
  /** Stops what this process started, newest first; servers that were already up are left running. */
  stop(): Promise<void>;
}

function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(2)} s`;
}

export function describeMariadb(instance: MariadbInstance): string {
  if (!instance.startedHere) return `MariaDB already up on ${instance.port}, reusing it`;
  const init = instance.initMs > 0 ? `initialised in ${seconds(instance.initMs)}, ` : '';
  return `MariaDB on ${instance.port}: ${init}started in ${seconds(instance.startMs)}`;
}

/** MariaDB, then Redis, the mail catcher, the S3 object store and the payment stand-in (unless only the database is wanted, as for db:migrate). */
export async function startServices(
  profile: Profile,
  options: { only?: 'mariadb'; log?: (line: string) => void } = {},
): Promise<Services> {
  const log = options.log ?? ((line: string) => process.stdout.write(`${line}\n`));
  mkdirSync(profile.dataDir, { recursive: true });
  const stops: (() => Promise<void>)[] = [];
  const stopAll = async () => {
    const errors: unknown[] = [];
    for (const stop of stops.splice(0).reverse()) {
      await stop().catch((error: unknown) => errors.push(error));
    }
    if (errors.length > 0) throw new AggregateError(errors, errors.map(String).join('; '));
  };
  try {
    const mariadb = await startMariadb({
      dataDir: profile.mariadb.dataDir,
      port: profile.mariadb.port,
      dbName: profile.mariadb.dbName,
      extraArgs: profile.mariadb.extraArgs,
    });
    if (mariadb.startedHere) stops.push(() => stopMariadb(mariadb));
    log(describeMariadb(mariadb));
    if (options.only === 'mariadb')
      return { mariadb, redis: null, mail: null, objectStore: null, payfake: null, stop: stopAll };

    const redis = await startRedis({ dataDir: profile.redis.dataDir, port: profile.redis.port });
    if (redis.startedHere) stops.push(() => stopRedis(redis));
    log(
      redis.startedHere
        ? `Redis on ${redis.port}: started in ${seconds(redis.startMs)}`
        : `Redis already up on ${redis.port}, reusing it`,
    );

    const mail = await startMailCatcher({ port: profile.smtpPort, outboxDir: profile.outboxDir });
    stops.push(() => mail.close());
    log(`Mail catcher on ${mail.port}: writing to ${profile.outboxDir}`);

    const objectStore = await startObjectStore({
      port: profile.s3.port,
      dataDir: profile.s3.dataDir,
      bucket: profile.s3.bucket,
    });
    stops.push(() => objectStore.close());
    log(`Object store (S3) on ${objectStore.port}: bucket ${objectStore.bucket} in ${profile.s3.dataDir}`);

    const payfake = await startPayfake({
      port: profile.payfake.port,
      secretKey: payfakeSecretKey,
      webhookUrl: payfakeWebhookUrl(profile),
      webhookSecret: payfakeWebhookSecret,
      log: (line) => log(`[payments] ${line}`),
    });
    stops.push(() => payfake.close());
    log(`Payment stand-in on ${payfake.port}: posting signed webhooks to ${payfakeWebhookUrl(profile)}`);
    return { mariadb, redis, mail, objectStore, payfake, stop: stopAll };
  } catch (error) {
    await stopAll().catch(() => undefined);
    throw error;
  }
}
