import { createApp } from './app.ts';
import { env } from './config/env.ts';
import { closeDeps, createDeps } from './create-deps.ts';

const deps = createDeps(env());
const app = createApp(deps);
const server = app.listen(deps.env.PORT, () => {
  deps.logger.info({ port: deps.env.PORT }, 'Heatfleet API listening');
});

// A failing dependency must never take the whole API down: log it and carry on answering 503s.
process.on('unhandledRejection', (err) => deps.logger.error({ err }, 'unhandled rejection'));

// How long requests already in flight get to finish at shutdown before their connections are cut.
const DRAIN_DEADLINE_MS = 10_000;

let stopping = false;
function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  deps.logger.info({ signal }, 'shutting down');
  // No new connections; requests in flight finish and are answered. A keep-alive connection is
  // closed as soon as it is idle (its answer sent), so close() completes when the last one is done.
  const sweep = setInterval(() => server.closeIdleConnections(), 250).unref();
  server.close(() => {
    clearInterval(sweep);
    void closeDeps(deps).finally(() => process.exit(0));
  });
  server.closeIdleConnections();
  setTimeout(() => {
    deps.logger.warn(
      { deadlineMs: DRAIN_DEADLINE_MS },
      'requests still open at the shutdown deadline; closing their connections',
    );
    server.closeAllConnections();
  }, DRAIN_DEADLINE_MS).unref();
  // closeDeps gets a few seconds more after the cut; a hang past that exits with a failure.
  setTimeout(() => process.exit(1), DRAIN_DEADLINE_MS + 5_000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
