import { startEmailWorker } from '@heatfleet/api/jobs/email-worker.ts';
import type { TestApp } from './test-app.ts';

/** Runs the real BullMQ e-mail worker against the test Redis and SMTP catcher for one test file. */
export function startTestEmailWorker(t: TestApp) {
  return startEmailWorker({ env: t.deps.env, db: t.deps.db, logger: t.deps.logger, clock: t.clock });
}
