import { demoAccounts, demoPassword } from '@heatfleet/devstack/src/demo-accounts.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { databasePassword, databaseUser } from '@heatfleet/devstack/src/profiles.ts';
import { cluster } from './cluster-profile.ts';
import { ClusterStack } from './cluster-stack.ts';

// npm run cluster: Heatfleet as it would run on several machines, here on loopback (docker-notes/README.md).
const life = new Lifecycle();
life.handleSignals(0);
const began = Date.now();

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

async function main(): Promise<void> {
  const stack = new ClusterStack(life, say, { dbName: cluster.dbName, recreateDatabase: false });
  await stack.start();
  // A replica or worker that dies on its own stops the cluster, as npm start does (drills kill them on purpose).
  for (const service of [...stack.apis, ...stack.workers]) if (service) life.watch(service);
  life.assertRunning();
  say(
    [
      '',
      `Heatfleet (cluster) is running at http://localhost:${cluster.proxy.apiPort}  (ready in ${((Date.now() - began) / 1000).toFixed(1)} s)`,
      `  Galera      ${cluster.galera.map((n) => `${n.name} 127.0.0.1:${n.sqlPort}`).join(', ')}; writes go through HAProxy 127.0.0.1:${cluster.proxy.sqlPort}`,
      `              database ${cluster.dbName}, user ${databaseUser} / ${databasePassword}; checks on ${cluster.galera.map((n) => n.checkPort).join(', ')}`,
      `  HAProxy     statistics at http://127.0.0.1:${cluster.proxy.statsPort}/`,
      `  Redis       ${cluster.redis.map((r) => r.port).join(', ')}; Sentinels ${cluster.sentinels.map((s) => s.port).join(', ')} (master name ${cluster.master.name})`,
      `  API         replicas on ${cluster.apiPorts.join(', ')}; ${cluster.workers} workers`,
      `  Mail        SMTP 127.0.0.1:${cluster.smtpPort}, read it at http://localhost:${cluster.proxy.apiPort}/outbox`,
      `  data, logs  ${cluster.dataDir} (the Galera folders belong to the mysql user)`,
      '',
      `Demo sign-ins, all with the password ${demoPassword}:`,
      ...demoAccounts.map((account) => `  ${account.email.padEnd(30)} ${account.role}`),
      '',
      'Ctrl-C stops everything (the Galera nodes one at a time; the next start rejoins them).',
    ].join('\n'),
  );
}

main().catch((error: unknown) => {
  if (life.stopping) return;
  void life.shutdown(
    1,
    `npm run cluster stopped: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`,
  );
});
