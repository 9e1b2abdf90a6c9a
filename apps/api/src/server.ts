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

let stopping = false;
function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  deps.logger.info({ signal }, 'shutting down');
  server.close(() => {
    void closeDeps(deps).finally(() => process.exit(0));
  });
  server.closeAllConnections();
  setTimeout(() => process.exit(1), 10_000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
