import { createServer, type Server } from 'node:http';
import { createConnection } from 'mysql2/promise';
import type { GaleraNode } from './cluster-profile.ts';

// The account the check agents (and the drill) read a node's state with: it may only connect and read status.
export const monitorUser = { user: 'hf_monitor', password: 'heatfleet-monitor-local' };

export const createMonitorUserSql = `
CREATE USER IF NOT EXISTS '${monitorUser.user}'@'127.0.0.1' IDENTIFIED BY '${monitorUser.password}';
GRANT USAGE ON *.* TO '${monitorUser.user}'@'127.0.0.1';`;

// Longer than a commit stall: while a frozen node is suspected (evs.suspect_timeout, 5 s) the cluster pauses, and a
// check that failed then would move the writes off a healthy node. A node that is gone refuses the connection at once.
const checkTimeoutMs = 6_000;

async function nodeState(node: GaleraNode): Promise<{ synced: boolean; detail: string }> {
  const connection = await createConnection({
    host: '127.0.0.1',
    port: node.sqlPort,
    ...monitorUser,
    connectTimeout: checkTimeoutMs,
  });
  try {
    // The status itself must not wait for the cluster (wsrep_sync_wait): a cut-off node would just time out.
    await connection.query({ sql: 'SET SESSION wsrep_sync_wait = 0', timeout: checkTimeoutMs });
    const [rows] = await connection.query({
      sql: "SHOW GLOBAL STATUS WHERE Variable_name IN ('wsrep_local_state', 'wsrep_cluster_status', 'wsrep_ready')",
      timeout: checkTimeoutMs,
    });
    const status = Object.fromEntries(
      (rows as { Variable_name: string; Value: string }[]).map((r) => [r.Variable_name, r.Value]),
    );
    const synced =
      status.wsrep_local_state === '4' && status.wsrep_cluster_status === 'Primary' && status.wsrep_ready === 'ON';
    return { synced, detail: JSON.stringify(status) };
  } finally {
    connection.destroy();
  }
}

/**
 * A node's check for HAProxy (as Galera's clustercheck does): 200 only while the node is Synced (wsrep_local_state
 * 4) in the Primary component and ready; 503 while it joins, donates, is cut off, or does not answer within 6 s.
 * A TCP check or HAProxy's mysql-check would pass a node that is up but not in the cluster.
 */
export function startCheckAgent(node: GaleraNode): Promise<Server> {
  const server = createServer((_req, res) => {
    let answered = false;
    const answer = (code: number, text: string) => {
      if (answered) return;
      answered = true;
      res.writeHead(code, { 'content-type': 'text/plain', connection: 'close' });
      res.end(`${node.name}: ${text}\n`);
    };
    const timer = setTimeout(() => answer(503, `no answer within ${checkTimeoutMs / 1000} s`), checkTimeoutMs + 200);
    nodeState(node)
      .then((s) => answer(s.synced ? 200 : 503, `${s.synced ? 'synced' : 'not synced'} ${s.detail}`))
      .catch((err: unknown) => answer(503, `unreachable (${err instanceof Error ? err.message : String(err)})`))
      .finally(() => clearTimeout(timer));
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(node.checkPort, '127.0.0.1', () => resolve(server));
  });
}
