import { env } from './config/env.ts';
import { createKnex } from './db/knex.ts';
import { startEmailWorker } from './jobs/email-worker.ts';
import { startReminderWorker } from './jobs/reminder-worker.ts';
import { systemClock } from './lib/clock.ts';
import { createLogger } from './lib/logger.ts';

const config = env();
const logger = createLogger(config.LOG_LEVEL);
const db = createKnex(config, logger);
const email = startEmailWorker({ env: config, db, logger, clock: systemClock });
const reminders = startReminderWorker({ env: config, db, logger, clock: systemClock });
logger.info('Heatfleet worker started');

process.on('unhandledRejection', (err) => logger.error({ err }, 'unhandled rejection'));
let stopping = false;
async function shutdown() {
  if (stopping) return;
  stopping = true;
  setTimeout(() => process.exit(1), 10_000).unref();
  await Promise.all([email.close(), reminders.close()]);
  await db.destroy();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown());
process.on('SIGINT', () => void shutdown());
