import { join } from 'node:path';
import { databasePassword, databaseUser } from '@heatfleet/devstack/src/profiles.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { mailFrom } from '@heatfleet/devstack/src/stack-env.ts';

// Ports of their own (34xx/44xx/64xx/54xx): none of dev, test slots 0-9, bench or drill uses them.
const dataDir = join(repoRoot, '.data', 'cluster');

export interface GaleraNode {
  name: string;
  dataDir: string;
  sqlPort: number;
  gcommPort: number;
  istPort: number;
  sstPort: number;
  /** The node's HTTP check agent: 200 only while the node is Synced in the Primary component. */
  checkPort: number;
}

export interface RedisNode {
  name: string;
  dataDir: string;
  port: number;
}

const nodes = [1, 2, 3];

export const cluster = {
  dataDir,
  logDir: join(dataDir, 'logs'),
  outboxDir: join(dataDir, 'outbox'),
  clusterName: 'heatfleet',
  dbName: 'heatfleet_cluster',
  galera: nodes.map((n): GaleraNode => ({
    name: `db${n}`,
    dataDir: join(dataDir, 'galera', `db${n}`),
    sqlPort: 3450 + n,
    gcommPort: 4450 + n,
    istPort: 4460 + n,
    sstPort: 4470 + n,
    checkPort: 9450 + n,
  })),
  /** HAProxy: the single-writer SQL port, the API's port, and its statistics page. */
  proxy: { dataDir: join(dataDir, 'haproxy'), sqlPort: 3450, apiPort: 5450, statsPort: 5459 },
  redis: [
    { name: 'redis1', dataDir: join(dataDir, 'redis', 'redis1'), port: 6451 },
    { name: 'redis2', dataDir: join(dataDir, 'redis', 'redis2'), port: 6452 },
  ] satisfies RedisNode[],
  sentinels: nodes.map((n): RedisNode => ({
    name: `sentinel${n}`,
    dataDir: join(dataDir, 'sentinel'),
    port: 26450 + n,
  })),
  /** The name the sentinels know the master by, and how many must agree that it is down. */
  master: { name: 'heatfleet', quorum: 2, downAfterMs: 1_500, failoverTimeoutMs: 10_000 },
  apiPorts: nodes.map((n) => 5450 + n),
  workers: 2,
  smtpPort: 2551,
  s3: { dataDir: join(dataDir, 's3'), port: 4591, bucket: 'heatfleet-photos', region: 'eu-west-2' },
  distDir: join(repoRoot, 'dist'),
};

export const baseUrl = `http://127.0.0.1:${cluster.proxy.apiPort}`;

/** The environment of every API replica and worker: the database through HAProxy, Redis through Sentinel. */
export function clusterEnv(sessionSecret: string, extra: Record<string, string> = {}): Record<string, string> {
  return {
    NODE_ENV: 'development',
    APP_ORIGIN: `http://localhost:${cluster.proxy.apiPort}`,
    TRUST_PROXY: '1',
    DATABASE_HOST: '127.0.0.1',
    DATABASE_PORT: String(cluster.proxy.sqlPort),
    DATABASE_USER: databaseUser,
    DATABASE_PASSWORD: databasePassword,
    DATABASE_NAME: cluster.dbName,
    REDIS_URL: 'redis://127.0.0.1',
    REDIS_SENTINELS: cluster.sentinels.map((s) => `127.0.0.1:${s.port}`).join(','),
    REDIS_SENTINEL_NAME: cluster.master.name,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(cluster.smtpPort),
    MAIL_FROM: mailFrom,
    S3_ENDPOINT: `http://127.0.0.1:${cluster.s3.port}`,
    S3_REGION: cluster.s3.region,
    S3_BUCKET: cluster.s3.bucket,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    S3_FORCE_PATH_STYLE: 'true',
    SESSION_SECRET: sessionSecret,
    OUTBOX_DIR: cluster.outboxDir,
    WEB_DIST_DIR: cluster.distDir,
    LOG_LEVEL: 'warn',
    ...extra,
  };
}
