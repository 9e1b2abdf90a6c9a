import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawn } from 'node:child_process';
import {
  databaseCharset,
  databaseCollation,
  killMariadb,
  mariadbErrorLog,
  mariadbIsUp,
  mariadbSocket,
  runMariadbSql,
  stopMariadb,
} from '@heatfleet/devstack/src/mariadb.ts';
import { capture, findExecutable, isAlive, lastLines, waitUntil } from '@heatfleet/devstack/src/processes.ts';
import { cluster, type GaleraNode } from './cluster-profile.ts';

const provider = '/usr/lib/galera/libgalera_smm.so';

/**
 * Each node's settings. A few are what Galera needs of every server (MariaDB Knowledge Base, "Configuring MariaDB
 * Galera Cluster": row-based binary log format, InnoDB, interleaved auto-increment locks); wsrep_sync_wait=1 makes
 * every read wait until the node has applied everything the cluster committed before it (a causal read), so a
 * node that has just taken over the writes, or one that was cut off, never answers from an older state.
 */
function nodeArgs(node: GaleraNode): string[] {
  const members = cluster.galera.map((n) => `127.0.0.1:${n.gcommPort}`).join(',');
  return [
    // As root the rsync state transfer drops its rights and fails: the nodes run as mysql, in folders it owns.
    '--user=mysql',
    '--wsrep-on=ON',
    `--wsrep-provider=${provider}`,
    `--wsrep-cluster-name=${cluster.clusterName}`,
    `--wsrep-cluster-address=gcomm://${members}`,
    `--wsrep-node-name=${node.name}`,
    '--wsrep-node-address=127.0.0.1',
    `--wsrep-node-incoming-address=127.0.0.1:${node.sqlPort}`,
    `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${node.gcommPort};ist.recv_addr=127.0.0.1:${node.istPort};gcache.size=128M`,
    '--wsrep-sst-method=rsync',
    `--wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    '--wsrep-sync-wait=1',
    '--binlog-format=ROW',
    '--default-storage-engine=InnoDB',
    '--innodb-autoinc-lock-mode=2',
    '--innodb-buffer-pool-size=96M',
    '--performance-schema=OFF',
    // Under Galera every node logs like a binary-log source, so routines and triggers made by the app's user (the
    // migrations) need this, as on any server with a binary log (MariaDB Knowledge Base, "Binary Logging of
    // Stored Routines").
    '--log-bin-trust-function-creators=ON',
  ];
}

async function chownToMysql(dir: string): Promise<void> {
  const result = await capture('chown', ['-R', 'mysql:mysql', dir]);
  if (result.code !== 0) throw new Error(`chown mysql ${dir} failed: ${result.stderr.trim()}`);
}

/** Initialises the node's folder once (as the mysql user); a folder holding mysql/ is kept as it is. */
export async function initialiseNode(node: GaleraNode): Promise<boolean> {
  if (existsSync(join(node.dataDir, 'mysql'))) return false;
  const staging = `${node.dataDir}.initialising`;
  rmSync(staging, { recursive: true, force: true });
  mkdirSync(staging, { recursive: true });
  await chownToMysql(staging);
  const result = await capture(
    findExecutable('mariadb-install-db'),
    [
      '--no-defaults',
      '--user=mysql',
      `--datadir=${staging}`,
      '--auth-root-authentication-method=socket',
      '--skip-test-db',
    ],
    { timeoutMs: 120_000 },
  );
  if (result.code !== 0) throw new Error(`mariadb-install-db failed for ${node.name}: ${result.stderr.trim()}`);
  rmSync(node.dataDir, { recursive: true, force: true });
  renameSync(staging, node.dataDir);
  await chownToMysql(node.dataDir);
  return true;
}

export function grastate(node: GaleraNode): { seqno: number; safeToBootstrap: boolean } | null {
  const file = join(node.dataDir, 'grastate.dat');
  if (!existsSync(file)) return null;
  const text = readFileSync(file, 'utf8');
  return {
    seqno: Number(/^seqno:\s*(-?\d+)/m.exec(text)?.[1] ?? -1),
    safeToBootstrap: /^safe_to_bootstrap:\s*1/m.test(text),
  };
}

/**
 * Which node starts a new primary component when none is running: the one Galera marked safe (the last to leave
 * cleanly); after a crash of all three, the one with the highest committed seqno, marked safe by hand as
 * Galera's documentation says to. A fresh cluster starts from the first node.
 */
export function chooseBootstrapNode(): GaleraNode {
  const states = cluster.galera.map((node) => ({ node, state: grastate(node) }));
  const safe = states.find((s) => s.state?.safeToBootstrap === true);
  if (safe) return safe.node;
  const known = states.filter((s) => s.state !== null).sort((a, b) => b.state!.seqno - a.state!.seqno);
  const chosen = known[0]?.node ?? cluster.galera[0]!;
  const file = join(chosen.dataDir, 'grastate.dat');
  if (existsSync(file))
    writeFileSync(file, readFileSync(file, 'utf8').replace(/^safe_to_bootstrap:\s*0/m, 'safe_to_bootstrap: 1'));
  return chosen;
}

export async function nodeIsUp(node: GaleraNode): Promise<boolean> {
  return mariadbIsUp(node);
}

/** The node's wsrep status variables (wsrep_local_state, wsrep_cluster_status, wsrep_cluster_size, ...). */
export async function wsrepStatus(node: GaleraNode): Promise<Record<string, string>> {
  const out = await runMariadbSql(node, "SHOW GLOBAL STATUS LIKE 'wsrep%';");
  const status: Record<string, string> = {};
  for (const line of out.split('\n')) {
    const [key, value] = line.split('\t');
    if (key) status[key.toLowerCase()] = value ?? '';
  }
  return status;
}

export async function isSynced(node: GaleraNode): Promise<boolean> {
  try {
    const s = await wsrepStatus(node);
    return s.wsrep_local_state === '4' && s.wsrep_cluster_status === 'Primary' && s.wsrep_ready === 'ON';
  } catch {
    return false;
  }
}

function serverArgs(node: GaleraNode): string[] {
  return [
    '--no-defaults',
    `--datadir=${node.dataDir}`,
    `--socket=${mariadbSocket(node)}`,
    `--port=${node.sqlPort}`,
    '--bind-address=127.0.0.1',
    `--pid-file=${join(node.dataDir, 'mariadbd.pid')}`,
    `--log-error=${mariadbErrorLog(node)}`,
    `--character-set-server=${databaseCharset}`,
    `--collation-server=${databaseCollation}`,
    '--default-time-zone=+00:00',
    '--skip-name-resolve',
    ...nodeArgs(node),
  ];
}

/**
 * After a crash (kill -9) grastate.dat holds seqno -1: the node does not know how far it got, and would ask for a
 * full copy (SST). Recovering the position from InnoDB first, as Debian's galera_recovery does, lets it ask for
 * only the write sets it missed (IST) from a donor's gcache.
 */
async function recoverPosition(node: GaleraNode): Promise<string | null> {
  const state = grastate(node);
  if (state === null || state.seqno !== -1) return null;
  const log = join(node.dataDir, 'wsrep-recover.log');
  rmSync(log, { force: true });
  const args = serverArgs(node).map((arg) => (arg.startsWith('--log-error=') ? `--log-error=${log}` : arg));
  await capture(findExecutable('mariadbd'), [...args, '--wsrep-recover'], { timeoutMs: 120_000 });
  if (!existsSync(log)) return null;
  const text = readFileSync(log, 'utf8');
  const found = [...text.matchAll(/WSREP: Recovered position: ([0-9a-f-]{36}:-?\d+)/g)].pop();
  return found?.[1] ?? null;
}

/** Starts one node: a new cluster from it (bootstrap), or joining the running ones; waits until it is Synced. */
export async function startNode(node: GaleraNode, options: { bootstrap: boolean }): Promise<{ ms: number }> {
  const began = Date.now();
  await initialiseNode(node);
  await chownToMysql(node.dataDir);
  // Spawned here, not by devstack's startMariadb: that one passes --user=root first, and the rsync state transfer
  // takes the first --user it finds among the server's arguments.
  const position = await recoverPosition(node);
  const child = spawn(
    findExecutable('mariadbd'),
    [
      ...serverArgs(node),
      ...(position !== null ? [`--wsrep-start-position=${position}`] : []),
      ...(options.bootstrap ? ['--wsrep-new-cluster'] : []),
    ],
    { detached: true, stdio: 'ignore' },
  );
  let exitNote: string | null = null;
  child.on('exit', (code, signal) => (exitNote = `mariadbd exited (${signal ?? `code ${code}`})`));
  child.unref();
  try {
    await waitUntil(`${node.name} on port ${node.sqlPort}`, () => mariadbIsUp(node), {
      timeoutMs: 300_000,
      intervalMs: 250,
      failEarly: () => exitNote,
    });
  } catch (error) {
    throw new Error(`${(error as Error).message}\nLast lines of ${errorLog(node)}:\n${lastLines(errorLog(node), 15)}`, {
      cause: error,
    });
  }
  await waitUntil(`${node.name} synced`, () => isSynced(node), { timeoutMs: 300_000, intervalMs: 250 });
  return { ms: Date.now() - began };
}

export function nodePid(node: GaleraNode): number | null {
  try {
    const pid = Number(readFileSync(join(node.dataDir, 'mariadbd.pid'), 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 && isAlive(pid) ? pid : null;
  } catch {
    return null;
  }
}

export function stopNode(node: GaleraNode): Promise<void> {
  return stopMariadb(node, 60_000);
}

export function killNode(node: GaleraNode): Promise<void> {
  return killMariadb(node);
}

export function errorLog(node: GaleraNode): string {
  return mariadbErrorLog(node);
}

/** The size of the error log now, so what a node writes from here on can be read alone. */
export function errorLogMark(node: GaleraNode): number {
  try {
    return statSync(errorLog(node)).size;
  } catch {
    return 0;
  }
}

export function errorLogSince(node: GaleraNode, mark: number): string {
  try {
    return readFileSync(errorLog(node)).subarray(mark).toString('utf8');
  } catch {
    return '';
  }
}
