import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import type { Server } from 'node:http';
import { join } from 'node:path';
import { apiFiles, assertFilesExist, toolFiles } from '@heatfleet/devstack/src/api-files.ts';
import type { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { startMailCatcher, type MailCatcher } from '@heatfleet/devstack/src/mail-catcher.ts';
import { ensureDatabase, runMariadbSql } from '@heatfleet/devstack/src/mariadb.ts';
import { startObjectStore, type ObjectStore } from '@heatfleet/devstack/src/object-store.ts';
import {
  assertPortsFree,
  httpAnswers200,
  nodeTsArgs,
  runStep,
  startService,
  waitUntil,
  type Service,
} from '@heatfleet/devstack/src/processes.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { createMonitorUserSql, startCheckAgent } from './check-agent.ts';
import { cluster, clusterEnv, type GaleraNode, type RedisNode } from './cluster-profile.ts';
import { chooseBootstrapNode, startNode, stopNode } from './galera.ts';
import { startHaproxy } from './haproxy.ts';
import { startRedisNode, startSentinel, waitForRedis } from './redis-sentinel.ts';

function sessionSecret(): string {
  const file = join(cluster.dataDir, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

/**
 * Every part of the cluster on loopback, each with a handle so a drill can take it away and bring it back.
 * Everything started here is stopped through the lifecycle, newest first: the app, then Redis, HAProxy, and the
 * Galera nodes one at a time (the last to stop is the one marked safe to start the cluster again).
 */
export class ClusterStack {
  readonly apis: (Service | null)[] = cluster.apiPorts.map(() => null);
  readonly workers: Service[] = [];
  readonly redis = new Map<string, Service>();
  mail: MailCatcher | null = null;
  objectStore: ObjectStore | null = null;
  env: Record<string, string> = {};

  constructor(
    private readonly life: Lifecycle,
    private readonly say: (line: string) => void,
    private readonly options: { dbName: string; recreateDatabase: boolean },
  ) {}

  async start(): Promise<void> {
    assertFilesExist([apiFiles.dbCli, apiFiles.server, apiFiles.worker]);
    mkdirSync(cluster.logDir, { recursive: true });
    await assertPortsFree([
      ...cluster.galera.flatMap((n) => [
        { port: n.sqlPort, what: `${n.name} SQL` },
        { port: n.gcommPort, what: `${n.name} group communication` },
        { port: n.checkPort, what: `${n.name} check agent` },
      ]),
      { port: cluster.proxy.sqlPort, what: 'HAProxy (SQL)' },
      { port: cluster.proxy.apiPort, what: 'HAProxy (API)' },
      ...[...cluster.redis, ...cluster.sentinels].map((r) => ({ port: r.port, what: r.name })),
      ...cluster.apiPorts.map((port) => ({ port, what: 'an API replica' })),
      { port: cluster.smtpPort, what: 'the mail catcher' },
      { port: cluster.s3.port, what: 'the object store' },
    ]);
    this.env = clusterEnv(sessionSecret(), { DATABASE_NAME: this.options.dbName });
    await this.startGalera();
    await this.startProxy();
    await this.startRedis();
    await this.startMailAndFiles();
    await this.migrate();
    await this.startApp();
  }

  private async startGalera(): Promise<void> {
    const first = chooseBootstrapNode();
    const began = Date.now();
    const boot = await startNode(first, { bootstrap: true });
    await this.life.add(first.name, () => stopNode(first));
    this.say(`Galera: ${first.name} started a new primary component in ${seconds(boot.ms)}`);
    await ensureDatabase(first, { dbName: this.options.dbName, recreate: this.options.recreateDatabase });
    await runMariadbSql(first, createMonitorUserSql);
    for (const node of cluster.galera.filter((n) => n !== first)) {
      const joined = await startNode(node, { bootstrap: false });
      await this.life.add(node.name, () => stopNode(node));
      this.say(`Galera: ${node.name} joined and synced in ${seconds(joined.ms)}`);
    }
    this.say(`Galera: 3 nodes synced after ${seconds(Date.now() - began)} (data in ${cluster.dataDir}/galera)`);
  }

  private async startProxy(): Promise<void> {
    const agents: Server[] = [];
    for (const node of cluster.galera) agents.push(await startCheckAgent(node));
    await this.life.add('the check agents', async () => {
      await Promise.all(agents.map((a) => new Promise((resolve) => a.close(resolve))));
    });
    const haproxy = startHaproxy();
    await this.life.add('HAProxy', () => haproxy.stop());
    await waitUntil('HAProxy writer port', () => this.writerAnswers(), { timeoutMs: 30_000, intervalMs: 250 });
    this.say(
      `HAProxy: SQL on ${cluster.proxy.sqlPort} (one writer, two backups), API on ${cluster.proxy.apiPort}, stats http://127.0.0.1:${cluster.proxy.statsPort}/`,
    );
  }

  private async writerAnswers(): Promise<boolean> {
    const { createConnection } = await import('mysql2/promise');
    try {
      const c = await createConnection({
        host: '127.0.0.1',
        port: cluster.proxy.sqlPort,
        user: this.env.DATABASE_USER,
        password: this.env.DATABASE_PASSWORD,
        connectTimeout: 1_000,
      });
      c.destroy();
      return true;
    } catch {
      return false;
    }
  }

  async startRedisNode(node: RedisNode): Promise<void> {
    const service = startRedisNode(node);
    this.redis.set(node.name, service);
    await this.life.add(node.name, () => this.redis.get(node.name)?.stop() ?? Promise.resolve());
    await waitForRedis(node);
  }

  private async startRedis(): Promise<void> {
    for (const node of cluster.redis) await this.startRedisNode(node);
    for (const sentinel of cluster.sentinels) {
      const service = startSentinel(sentinel);
      this.redis.set(sentinel.name, service);
      await this.life.add(sentinel.name, () => service.stop());
      await waitForRedis(sentinel);
    }
    this.say(
      `Redis: ${cluster.redis.map((r) => r.port).join(' and ')} (one master, one replica), Sentinels on ${cluster.sentinels.map((s) => s.port).join(', ')} (quorum ${cluster.master.quorum})`,
    );
  }

  private async startMailAndFiles(): Promise<void> {
    this.mail = await startMailCatcher({ port: cluster.smtpPort, outboxDir: cluster.outboxDir });
    await this.life.add('the mail catcher', () => this.mail?.close() ?? Promise.resolve());
    this.objectStore = await startObjectStore({
      port: cluster.s3.port,
      dataDir: cluster.s3.dataDir,
      bucket: cluster.s3.bucket,
    });
    await this.life.add('the object store', () => this.objectStore?.close() ?? Promise.resolve());
  }

  /** Once, through the single writer, before any replica starts: never from each replica (they would race). */
  private async migrate(): Promise<void> {
    const env = { ...process.env, ...this.env };
    for (const [title, args] of [
      ['Migrating (once, through HAProxy)', ['migrate']],
      ['Seeding the demo firms (only the first time)', ['seed']],
    ] as const) {
      this.life.assertRunning();
      this.say(`${title}…`);
      const code = await runStep(process.execPath, nodeTsArgs(apiFiles.dbCli, [...args]), { env, cwd: repoRoot });
      if (code !== 0) throw new Error(`${title} failed (exit ${code}).`);
    }
    if (!existsSync(join(cluster.distDir, 'index.html'))) {
      this.say('Building the client…');
      const code = await runStep(process.execPath, [toolFiles.vite, 'build', '--logLevel', 'warn'], {
        env: { ...process.env, NODE_ENV: 'production' },
        cwd: repoRoot,
      });
      if (code !== 0) throw new Error(`Building the client failed (exit ${code}).`);
    }
  }

  startApi(index: number): Service {
    const port = cluster.apiPorts[index]!;
    const service = startService({
      name: `api${index + 1}`,
      command: process.execPath,
      args: nodeTsArgs(apiFiles.server),
      env: { ...process.env, ...this.env, PORT: String(port) },
      logFile: join(cluster.logDir, `api${index + 1}.log`),
      quiet: true,
    });
    this.apis[index] = service;
    return service;
  }

  async waitForApi(index: number): Promise<void> {
    const service = this.apis[index]!;
    const url = `http://127.0.0.1:${cluster.apiPorts[index]}/api/health`;
    await waitUntil(url, () => httpAnswers200(url), {
      timeoutMs: 180_000,
      intervalMs: 500,
      failEarly: () => (service.hasExited() ? `${service.name} exited; its log: ${service.logFile}` : null),
    });
  }

  private async startApp(): Promise<void> {
    for (let i = 0; i < cluster.apiPorts.length; i += 1) {
      this.startApi(i);
      await this.life.add(`api${i + 1}`, () => this.apis[i]?.stop() ?? Promise.resolve());
    }
    for (let i = 0; i < cluster.workers; i += 1) {
      const worker = startService({
        name: `worker${i + 1}`,
        command: process.execPath,
        args: nodeTsArgs(apiFiles.worker),
        env: { ...process.env, ...this.env },
        logFile: join(cluster.logDir, `worker${i + 1}.log`),
        quiet: true,
      });
      this.workers.push(worker);
      await this.life.add(worker.name, () => worker.stop());
    }
    for (let i = 0; i < cluster.apiPorts.length; i += 1) await this.waitForApi(i);
    const url = `http://127.0.0.1:${cluster.proxy.apiPort}/api/health`;
    await waitUntil('the API through HAProxy', () => httpAnswers200(url), { timeoutMs: 30_000, intervalMs: 250 });
    this.say(
      `API: ${cluster.apiPorts.length} replicas on ${cluster.apiPorts.join(', ')} behind http://localhost:${cluster.proxy.apiPort}; ${cluster.workers} workers`,
    );
  }

  galeraNode(name: string): GaleraNode {
    const node = cluster.galera.find((n) => n.name === name);
    if (!node) throw new Error(`No Galera node ${name}`);
    return node;
  }
}
