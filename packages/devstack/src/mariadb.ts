import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync } from 'node:fs';
import { userInfo } from 'node:os';
import { dirname, join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { databasePassword, databaseUser } from './profiles.ts';
import { capture, findExecutable, isAlive, lastLines, waitUntil } from './processes.ts';

export interface MariadbTarget {
  /** The instance's own folder: data files, socket, pid file and error log all live in it. */
  dataDir: string;
}

export interface MariadbOptions extends MariadbTarget {
  port: number;
  /** When given, this database and the app user are created (if missing) once the server answers. */
  dbName?: string;
  user?: string;
  password?: string;
  extraArgs?: string[];
  timeoutMs?: number;
}

export interface MariadbInstance extends MariadbTarget {
  port: number;
  socket: string;
  pid: number | null;
  /** False when a server was already up on the socket: then the caller must leave it running. */
  startedHere: boolean;
  /** Milliseconds spent in mariadb-install-db (0 when the folder was already initialised). */
  initMs: number;
  /** Milliseconds from spawning mariadbd to its first successful ping. */
  startMs: number;
}

// With --no-defaults the server would fall back to latin1. New tables take the database's collation, which the
// app keeps by leaving knex's charset unset.
export const databaseCharset = 'utf8mb4';
export const databaseCollation = 'utf8mb4_unicode_520_ci';

// sun_path in sockaddr_un holds 108 bytes on Linux, including the final NUL.
const maxSocketPathLength = 107;

export function mariadbSocket(target: MariadbTarget): string {
  return join(target.dataDir, 'mariadb.sock');
}

function pidFile(target: MariadbTarget): string {
  return join(target.dataDir, 'mariadbd.pid');
}

export function mariadbErrorLog(target: MariadbTarget): string {
  return join(target.dataDir, 'mariadbd.err');
}

// Over the socket, mariadb-install-db's socket-authenticated account is the OS user running it (root here).
function adminUser(): string {
  return userInfo().username;
}

function readPid(target: MariadbTarget): number | null {
  try {
    const pid = Number(readFileSync(pidFile(target), 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

// A stale pid file may name a pid the system has since given to something else.
function isMariadbd(pid: number | null): pid is number {
  if (pid === null || !isAlive(pid)) return false;
  try {
    return readFileSync(`/proc/${pid}/comm`, 'utf8').trim() === 'mariadbd';
  } catch {
    return true;
  }
}

export async function mariadbIsUp(target: MariadbTarget): Promise<boolean> {
  const socket = mariadbSocket(target);
  if (!existsSync(socket)) return false;
  const result = await capture(findExecutable('mariadb-admin'), [
    '--no-defaults',
    `--socket=${socket}`,
    `-u${adminUser()}`,
    '--connect-timeout=2',
    'ping',
  ]);
  return result.code === 0;
}

/** Runs SQL over the socket as the admin account; throws with the server's message on failure. */
export async function runMariadbSql(target: MariadbTarget, sql: string): Promise<string> {
  const result = await capture(
    findExecutable('mariadb'),
    ['--no-defaults', `--socket=${mariadbSocket(target)}`, `-u${adminUser()}`, '--batch', '--skip-column-names'],
    { input: sql },
  );
  if (result.code !== 0) throw new Error(`SQL failed on ${target.dataDir}: ${result.stderr.trim()}`);
  return result.stdout;
}

function assertIdentifier(value: string, what: string): void {
  if (!/^[A-Za-z0-9_]{1,64}$/.test(value)) throw new Error(`${what} "${value}" must be letters, digits and _ only.`);
}

function sqlString(value: string): string {
  return `'${value.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;
}

/**
 * Creates the database and the app user (password login from 127.0.0.1 over TCP and localhost over the socket).
 * The grant also covers `<dbName>_*` databases, so tests may make extra throwaway databases of their own.
 */
export async function ensureDatabase(
  target: MariadbTarget,
  options: { dbName: string; user?: string; password?: string; recreate?: boolean },
): Promise<void> {
  const user = options.user ?? databaseUser;
  const password = sqlString(options.password ?? databasePassword);
  assertIdentifier(options.dbName, 'Database name');
  assertIdentifier(user, 'Database user');
  const hosts = ["'127.0.0.1'", "'localhost'"];
  const statements = [
    options.recreate === true ? `DROP DATABASE IF EXISTS \`${options.dbName}\`;` : '',
    `CREATE DATABASE IF NOT EXISTS \`${options.dbName}\` CHARACTER SET ${databaseCharset} COLLATE ${databaseCollation};`,
    ...hosts.flatMap((host) => [
      `CREATE USER IF NOT EXISTS '${user}'@${host} IDENTIFIED BY ${password};`,
      `ALTER USER '${user}'@${host} IDENTIFIED BY ${password};`,
      `GRANT ALL PRIVILEGES ON \`${options.dbName}\`.* TO '${user}'@${host};`,
      `GRANT ALL PRIVILEGES ON \`${options.dbName.replace(/_/g, '\\_')}\\_%\`.* TO '${user}'@${host};`,
    ]),
  ];
  await runMariadbSql(target, statements.join('\n'));
}

async function initialise(target: MariadbTarget): Promise<number> {
  const began = Date.now();
  // Initialise beside the real folder and rename at the end, so an interrupted first run never leaves a
  // half-made data folder that looks finished.
  const staging = `${target.dataDir}.initialising`;
  // Never wipe a folder of someone else's: only one that is missing, empty or holds our own leftovers.
  const ownLeftovers = new Set(['mariadbd.err', 'mariadbd.pid', 'mariadb.sock']);
  const foreign = existsSync(target.dataDir)
    ? readdirSync(target.dataDir).filter((name) => !ownLeftovers.has(name))
    : [];
  if (foreign.length > 0) {
    throw new Error(
      `${target.dataDir} is not a MariaDB data folder (no mysql/ in it) but is not empty: move it away and try again.`,
    );
  }
  rmSync(staging, { recursive: true, force: true });
  mkdirSync(dirname(target.dataDir), { recursive: true });
  const result = await capture(
    findExecutable('mariadb-install-db'),
    [
      '--no-defaults',
      `--user=${adminUser()}`,
      `--datadir=${staging}`,
      '--auth-root-authentication-method=socket',
      '--skip-test-db',
    ],
    { timeoutMs: 120_000 },
  );
  if (result.code !== 0) {
    throw new Error(`mariadb-install-db failed (exit ${result.code}):\n${result.stdout}\n${result.stderr}`.trim());
  }
  if (existsSync(target.dataDir)) rmSync(target.dataDir, { recursive: true, force: true });
  renameSync(staging, target.dataDir);
  return Date.now() - began;
}

/**
 * Starts a private mariadbd for dataDir (initialising the folder on first use) and waits until it answers.
 * If one is already up on that folder's socket, it is reused and reported with startedHere: false.
 */
export async function startMariadb(options: MariadbOptions): Promise<MariadbInstance> {
  const socket = mariadbSocket(options);
  if (socket.length > maxSocketPathLength) {
    throw new Error(
      `The MariaDB socket path is too long for Linux (${socket.length} > ${maxSocketPathLength}): ${socket}`,
    );
  }
  const timeoutMs = options.timeoutMs ?? 60_000;
  const instance: MariadbInstance = {
    dataDir: options.dataDir,
    port: options.port,
    socket,
    pid: null,
    startedHere: false,
    initMs: 0,
    startMs: 0,
  };

  // A server still starting (pid alive, socket not yet answering) is waited for rather than doubled.
  const existingPid = readPid(options);
  if (isMariadbd(existingPid) && !(await mariadbIsUp(options))) {
    await waitUntil(`MariaDB (pid ${existingPid}) in ${options.dataDir}`, () => mariadbIsUp(options), {
      timeoutMs,
      failEarly: () => (isAlive(existingPid) ? null : 'it exited'),
    }).catch(() => undefined);
  }

  if (await mariadbIsUp(options)) {
    instance.pid = readPid(options);
  } else {
    if (!existsSync(join(options.dataDir, 'mysql'))) instance.initMs = await initialise(options);
    const args = [
      '--no-defaults',
      `--user=${adminUser()}`,
      `--datadir=${options.dataDir}`,
      `--socket=${socket}`,
      `--port=${options.port}`,
      '--bind-address=127.0.0.1',
      `--pid-file=${pidFile(options)}`,
      `--log-error=${mariadbErrorLog(options)}`,
      `--character-set-server=${databaseCharset}`,
      `--collation-server=${databaseCollation}`,
      // Store and compare times in UTC whatever the machine's zone; the app converts for display.
      '--default-time-zone=+00:00',
      // No DNS lookups per connection (the network here is closed); the users are granted by IP anyway.
      '--skip-name-resolve',
      ...(options.extraArgs ?? []),
    ];
    const began = Date.now();
    const child = spawn(findExecutable('mariadbd'), args, { detached: true, stdio: 'ignore' });
    let exitNote: string | null = null;
    child.on('exit', (code, signal) => (exitNote = `mariadbd exited (${signal ?? `code ${code}`})`));
    child.on('error', (error) => (exitNote = error.message));
    child.unref();
    try {
      await waitUntil(`MariaDB on port ${options.port}`, () => mariadbIsUp(options), {
        timeoutMs,
        intervalMs: 50,
        failEarly: () => exitNote,
      });
    } catch (error) {
      throw new Error(
        `${(error as Error).message}\nLast lines of ${mariadbErrorLog(options)}:\n${lastLines(mariadbErrorLog(options), 15)}`,
        {
          cause: error,
        },
      );
    }
    instance.startMs = Date.now() - began;
    instance.pid = child.pid ?? readPid(options);
    instance.startedHere = true;
  }

  if (options.dbName !== undefined) {
    await ensureDatabase(options, { dbName: options.dbName, user: options.user, password: options.password });
  }
  return instance;
}

async function waitForExit(pid: number | null, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (isMariadbd(pid)) {
    if (Date.now() > deadline) return false;
    await sleep(50);
  }
  return true;
}

/** Clean shutdown through mariadb-admin; waits until the process is gone. */
export async function stopMariadb(target: MariadbTarget, timeoutMs = 30_000): Promise<void> {
  const pid = readPid(target);
  if (await mariadbIsUp(target)) {
    const result = await capture(
      findExecutable('mariadb-admin'),
      ['--no-defaults', `--socket=${mariadbSocket(target)}`, `-u${adminUser()}`, 'shutdown'],
      { timeoutMs },
    );
    if (result.code !== 0 && (await mariadbIsUp(target))) {
      throw new Error(`mariadb-admin shutdown failed: ${result.stderr.trim()}`);
    }
  }
  if (!(await waitForExit(pid, timeoutMs)))
    throw new Error(`MariaDB (pid ${pid}) did not stop within ${timeoutMs / 1000} s.`);
}

/** Kills the server with SIGKILL, as a crash or an outage would; InnoDB recovers on the next start. */
export async function killMariadb(target: MariadbTarget): Promise<void> {
  const pid = readPid(target);
  if (!isMariadbd(pid)) return;
  process.kill(pid, 'SIGKILL');
  await waitForExit(pid, 10_000);
}
