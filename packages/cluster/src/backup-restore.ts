import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { mariadbSocket, runMariadbSql, startMariadb, stopMariadb } from '@heatfleet/devstack/src/mariadb.ts';
import { capture, findExecutable } from '@heatfleet/devstack/src/processes.ts';
import { cluster } from './cluster-profile.ts';

// node --import tsx packages/cluster/src/backup-restore.ts, with `npm run cluster` running: a full backup with
// mariadb-backup from a node that is not taking the writes, prepared, restored into a throwaway server of its own,
// and every table's row count compared with the cluster at the backup's position (docker-notes/README.md, Backups).
const source = cluster.galera[2]!;
const backupDir = join(cluster.dataDir, 'backup-test', 'backup');
const restored = { dataDir: join(cluster.dataDir, 'backup-test', 'restored'), port: 3459 };
const db = cluster.dbName;

async function step(what: string, command: string, args: string[]): Promise<number> {
  const began = Date.now();
  const result = await capture(findExecutable(command), args, { timeoutMs: 600_000 });
  if (result.code !== 0) throw new Error(`${what} failed: ${result.stderr.split('\n').slice(-5).join('\n')}`);
  const ms = Date.now() - began;
  process.stdout.write(`${what}: ${(ms / 1000).toFixed(1)} s\n`);
  return ms;
}

async function tableCounts(target: { dataDir: string }): Promise<Map<string, number>> {
  const tables = (await runMariadbSql(target, `SHOW TABLES FROM \`${db}\`;`)).trim().split('\n').filter(Boolean);
  const sql = tables.map((t) => `SELECT '${t}', COUNT(*) FROM \`${db}\`.\`${t}\`;`).join('\n');
  const out = await runMariadbSql(target, sql);
  return new Map(
    out
      .trim()
      .split('\n')
      .map((line) => [line.split('\t')[0]!, Number(line.split('\t')[1])]),
  );
}

async function main(): Promise<void> {
  rmSync(join(cluster.dataDir, 'backup-test'), { recursive: true, force: true });
  mkdirSync(join(cluster.dataDir, 'backup-test'), { recursive: true });
  // Writes stop for the comparison only: the backup itself runs while the cluster serves (--galera-info records
  // the position; the node desyncs itself for the short lock at the end, so HAProxy's check takes it out meanwhile).
  const backupMs = await step('Backup from db3', 'mariadb-backup', [
    '--backup',
    '--galera-info',
    `--socket=${mariadbSocket(source)}`,
    '--user=root',
    `--target-dir=${backupDir}`,
  ]);
  const prepareMs = await step('Prepare', 'mariadb-backup', ['--prepare', `--target-dir=${backupDir}`]);
  const restoreMs = await step('Restore (copy back)', 'mariadb-backup', [
    '--copy-back',
    `--target-dir=${backupDir}`,
    `--datadir=${restored.dataDir}`,
  ]);
  const position = readFileSync(join(backupDir, 'xtrabackup_galera_info'), 'utf8').trim();
  await startMariadb({ dataDir: restored.dataDir, port: restored.port, timeoutMs: 120_000 });
  try {
    const [fromCluster, fromBackup] = [await tableCounts(source), await tableCounts(restored)];
    const differ = [...fromCluster].filter(([t, n]) => fromBackup.get(t) !== n);
    const rows = [...fromBackup.values()].reduce((a, b) => a + b, 0);
    process.stdout.write(
      `${JSON.stringify({ position, backupMs, prepareMs, restoreMs, tables: fromBackup.size, rows, differ }, null, 2)}\n`,
    );
  } finally {
    await stopMariadb(restored);
    rmSync(join(cluster.dataDir, 'backup-test'), { recursive: true, force: true });
  }
}

await main();
