import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { apiFiles, assertFilesExist } from '@heatfleet/devstack/src/api-files.ts';
import type { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { startMailCatcher, type MailCatcher } from '@heatfleet/devstack/src/mail-catcher.ts';
import { ensureDatabase, killMariadb, startMariadb, stopMariadb } from '@heatfleet/devstack/src/mariadb.ts';
import { startObjectStore, type ObjectStore } from '@heatfleet/devstack/src/object-store.ts';
import {
  assertPortsFree,
  httpAnswers200,
  isAlive,
  nodeTsArgs,
  portIsFree,
  runStep,
  startService,
  waitUntil,
  type Service,
} from '@heatfleet/devstack/src/processes.ts';
import { getProfile } from '@heatfleet/devstack/src/profiles.ts';
import { flushRedis, redisIsUp, startRedis, stopRedis } from '@heatfleet/devstack/src/redis.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { childEnv, stackEnv } from '@heatfleet/devstack/src/stack-env.ts';

export const profile = getProfile('drill');

/** A Redis left running by an interrupted drill is ours to reuse; one of anybody else's on the port is not. */
function ownRedisIsRunning(): boolean {
  const file = join(profile.redis.dataDir, 'redis-server.pid');
  if (!existsSync(file)) return false;
  const pid = Number(readFileSync(file, 'utf8').trim());
  return Number.isInteger(pid) && pid > 0 && isAlive(pid);
}

/**
 * The drill's own stack (profile 'drill': its own ports and .data/drill), with a handle on each part so a
 * drill can take it away and bring it back. Everything started here is stopped through the lifecycle.
 */
export class DrillStack {
  mail: MailCatcher | null = null;
  objectStore: ObjectStore | null = null;
  api: Service | null = null;
  worker: Service | null = null;
  readonly env = stackEnv(profile);
  readonly baseUrl = `http://127.0.0.1:${profile.appPort}`;

  constructor(
    private readonly life: Lifecycle,
    private readonly say: (line: string) => void,
  ) {}

  async prepare(): Promise<void> {
    assertFilesExist([apiFiles.dbCli, apiFiles.server, apiFiles.worker]);
    await assertPortsFree([
      { port: profile.appPort, what: 'the drill API' },
      { port: profile.smtpPort, what: 'the drill mail catcher' },
      { port: profile.s3.port, what: 'the drill object store' },
    ]);
    // The drill empties its Redis and database: never do that to a server that is not the drill's own.
    if (!(await portIsFree(profile.redis.port)) && !ownRedisIsRunning()) {
      throw new Error(
        `Port ${profile.redis.port} (the drill's Redis) is held by a server that is not the drill's: stop it and try again.`,
      );
    }
    // Each run starts from nothing, so every count in the report is this run's.
    for (const dir of [profile.outboxDir, profile.s3.dataDir]) {
      rmSync(dir, { recursive: true, force: true });
      mkdirSync(dir, { recursive: true });
    }
    await this.startMariadb();
    await this.life.add('MariaDB', () => stopMariadb(profile.mariadb));
    await ensureDatabase(profile.mariadb, { dbName: profile.mariadb.dbName, recreate: true });
    this.say(`MariaDB on ${profile.mariadb.port}: database ${profile.mariadb.dbName} created afresh`);
    await this.startRedis();
    await this.life.add('Redis', () => stopRedis(profile.redis));
    await flushRedis(profile.redis);
    this.say(`Redis on ${profile.redis.port}: emptied`);
    await this.startMail();
    await this.life.add('the mail catcher', async () => this.stopMail());
    await this.startObjectStore();
    await this.life.add('the object store', async () => this.stopObjectStore());
    this.say(`Mail catcher on ${profile.smtpPort}, object store on ${profile.s3.port}`);

    const env = childEnv(profile);
    for (const [title, args] of [
      ['Migrating', ['migrate']],
      ['Seeding the demo firms', ['seed']],
    ] as const) {
      this.say(`${title}…`);
      const code = await runStep(process.execPath, nodeTsArgs(apiFiles.dbCli, [...args]), { env, cwd: repoRoot });
      if (code !== 0) throw new Error(`${title} failed (exit ${code}).`);
    }
  }

  async startApp(): Promise<void> {
    const env = childEnv(profile);
    this.api = startService({
      name: 'api',
      command: process.execPath,
      args: nodeTsArgs(apiFiles.server),
      env,
      logFile: join(profile.logDir, 'api.log'),
      quiet: true,
    });
    await this.life.add('the API', () => this.api?.stop() ?? Promise.resolve());
    this.worker = startService({
      name: 'worker',
      command: process.execPath,
      args: nodeTsArgs(apiFiles.worker),
      env,
      logFile: join(profile.logDir, 'worker.log'),
      quiet: true,
    });
    await this.life.add('the worker', () => this.worker?.stop() ?? Promise.resolve());
    const api = this.api;
    await waitUntil(`${this.baseUrl}/api/health`, () => httpAnswers200(`${this.baseUrl}/api/health`), {
      timeoutMs: 90_000,
      intervalMs: 200,
      failEarly: () => (api.hasExited() ? `the API exited; its log: ${api.logFile}` : null),
    });
    this.say(`API on ${this.baseUrl} (pid ${this.api.pid}), worker pid ${this.worker.pid}; logs in ${profile.logDir}`);
  }

  async startMariadb(): Promise<void> {
    await startMariadb({
      dataDir: profile.mariadb.dataDir,
      port: profile.mariadb.port,
      extraArgs: profile.mariadb.extraArgs,
    });
  }

  killMariadb(): Promise<void> {
    return killMariadb(profile.mariadb);
  }

  async startRedis(): Promise<void> {
    await startRedis({ dataDir: profile.redis.dataDir, port: profile.redis.port });
  }

  stopRedis(): Promise<void> {
    return stopRedis(profile.redis);
  }

  redisIsUp(): Promise<boolean> {
    return redisIsUp(profile.redis);
  }

  async startMail(): Promise<void> {
    this.mail = await startMailCatcher({ port: profile.smtpPort, outboxDir: profile.outboxDir });
  }

  async stopMail(): Promise<void> {
    const mail = this.mail;
    this.mail = null;
    await mail?.close();
  }

  async startObjectStore(): Promise<void> {
    this.objectStore = await startObjectStore({
      port: profile.s3.port,
      dataDir: profile.s3.dataDir,
      bucket: profile.s3.bucket,
    });
  }

  async stopObjectStore(): Promise<void> {
    const store = this.objectStore;
    this.objectStore = null;
    await store?.close();
  }
}
