import { startBenchMariadb, startBenchRedis, stopBenchMariadb, stopBenchRedis } from './bench-stack.ts';

// Keeps the bench MariaDB and Redis up until interrupted, so several measurements (measure-reads.ts) and queries
// by hand share one warm buffer pool instead of each starting and stopping the server.
const mariadb = await startBenchMariadb();
const redis = await startBenchRedis();
process.stdout.write(`bench MariaDB on ${mariadb.port}, Redis on ${redis.port}; Ctrl-C stops them\n`);
const stop = async () => {
  await stopBenchRedis(redis);
  await stopBenchMariadb(mariadb);
  process.exit(0);
};
process.on('SIGINT', () => void stop()).on('SIGTERM', () => void stop());
setInterval(() => undefined, 60_000);
