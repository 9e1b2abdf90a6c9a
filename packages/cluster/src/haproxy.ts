import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { findExecutable, startService, type Service } from '@heatfleet/devstack/src/processes.ts';
import { cluster } from './cluster-profile.ts';

/**
 * One HAProxy, two jobs. SQL: every connection to one Galera node, the others backups, judged by each node's check
 * agent, because a row lock (SELECT ... FOR UPDATE, which keeps stock from going below zero) holds only on the node
 * that took it. The API: round robin over the replicas, judged by GET /api/health (200 only when the replica
 * reaches the database). Check every second; 3 failures in a row take a server out, 2 successes put it back.
 */
export function haproxyConfig(): string {
  const [first, ...others] = cluster.galera;
  const galeraServers = [
    `  server ${first!.name} 127.0.0.1:${first!.sqlPort} check port ${first!.checkPort}`,
    ...others.map((n) => `  server ${n.name} 127.0.0.1:${n.sqlPort} check port ${n.checkPort} backup`),
  ];
  const apiServers = cluster.apiPorts.map((port, i) => `  server api${i + 1} 127.0.0.1:${port} check`);
  return `# Written by packages/cluster at each start: edit haproxy.ts, not this file.
global
  maxconn 4000
  stats socket ${join(cluster.proxy.dataDir, 'admin.sock')} mode 600 level admin

defaults
  timeout connect 2s
  # A pooled database connection may sit idle for a long time: the pool, not the proxy, decides when it goes.
  timeout client 1h
  timeout server 1h
  default-server inter 1s fall 3 rise 2
  timeout check 7s

frontend galera_writer
  mode tcp
  bind 127.0.0.1:${cluster.proxy.sqlPort}
  default_backend galera

backend galera
  mode tcp
  option httpchk GET /
  http-check expect status 200
  # A node marked down has its connections cut, so no client keeps writing to it; when the first node returns,
  # connections to the backup are cut too, so there is never more than one node taking writes for long.
  default-server on-marked-down shutdown-sessions on-marked-up shutdown-backup-sessions
${galeraServers.join('\n')}

frontend api
  mode http
  bind 127.0.0.1:${cluster.proxy.apiPort}
  timeout client 60s
  option forwardfor
  default_backend api

backend api
  mode http
  balance roundrobin
  timeout server 60s
  option httpchk
  http-check send meth GET uri /api/health ver HTTP/1.1 hdr Host 127.0.0.1
  http-check expect status 200
  # A connection refused by a replica that just died goes to another one; a request already sent is not resent
  # (it may have been applied): the client retries it with the same Idempotency-Key.
  retries 2
  option redispatch 1
  retry-on conn-failure
${apiServers.join('\n')}

listen stats
  mode http
  bind 127.0.0.1:${cluster.proxy.statsPort}
  timeout client 30s
  timeout server 30s
  stats enable
  stats uri /
  stats refresh 2s
`;
}

export function startHaproxy(): Service {
  mkdirSync(cluster.proxy.dataDir, { recursive: true });
  const file = join(cluster.proxy.dataDir, 'haproxy.cfg');
  writeFileSync(file, haproxyConfig());
  return startService({
    name: 'haproxy',
    command: findExecutable('haproxy'),
    args: ['-f', file, '-db'],
    env: process.env,
    logFile: join(cluster.logDir, 'haproxy.log'),
    quiet: true,
  });
}

/** The state HAProxy holds of each server (UP, DOWN, ...), from its admin socket's `show stat`. */
export async function haproxyServerStates(): Promise<Record<string, string>> {
  const { createConnection } = await import('node:net');
  const text = await new Promise<string>((resolve, reject) => {
    const socket = createConnection(join(cluster.proxy.dataDir, 'admin.sock'));
    let out = '';
    socket.on('data', (chunk) => (out += chunk.toString()));
    socket.on('end', () => resolve(out));
    socket.on('error', reject);
    socket.end('show stat\n');
  });
  const states: Record<string, string> = {};
  for (const line of text.split('\n')) {
    const cols = line.split(',');
    if (cols.length > 17 && cols[1] !== 'FRONTEND' && cols[1] !== 'BACKEND' && !line.startsWith('#'))
      states[`${cols[0]}/${cols[1]}`] = cols[17] ?? '';
  }
  return states;
}
