import { readFileSync } from 'node:fs';
import { createKnex } from '@heatfleet/api/db/knex.ts';
import { migrateLatest } from '@heatfleet/api/db/migrations.ts';
import * as overviewDal from '@heatfleet/api/modules/overview/overview-dal.ts';
import {
  listBatchesHeldExpiringBy,
  listBatchTotalsExpiringBy,
  listPlacesHoldingBatches,
} from '@heatfleet/api/modules/reminders/reminder-stock-dal.ts';
import { firmBookedJobs } from '@heatfleet/api/modules/stock/booked-need-service.ts';
import { listBatchExpiries, listActiveProductSummaries } from '@heatfleet/api/modules/stock/product-dal.ts';
import { stockLevels } from '@heatfleet/api/modules/stock/stock-query-service.ts';
import {
  listActivePlaces,
  listBalanceRows,
  sumActiveBalancesByBatch,
} from '@heatfleet/api/modules/stock/stock-level-dal.ts';
import { addDays, calendarDateIn } from '@heatfleet/domain';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import {
  benchDatabase,
  benchStack,
  startBenchMariadb,
  startBenchRedis,
  stopBenchMariadb,
  stopBenchRedis,
} from './bench-stack.ts';
import type { GeneratedDatabase } from './generate-large-firm.ts';

// `node --import tsx packages/bench/src/read-parts.ts [--firms large,small] [--count 15]`: each query (or service
// step) of the overview and the stock grid timed alone against the bench database, straight through the API's own
// functions, median of --count. Says which part of a read grows from the small firm to the large one (README,
// Performance: "A quiet machine").
const args = process.argv.slice(2);
const option = (name: string) => {
  const at = args.indexOf(`--${name}`);
  return at >= 0 ? args[at + 1] : undefined;
};
const firmKeys = (option('firms') ?? 'large,medium,small').split(',');
const count = Number(option('count') ?? 15);
const life = new Lifecycle();
life.handleSignals(130);

async function main(): Promise<void> {
  const mariadb = await startBenchMariadb();
  await life.add('the bench MariaDB', () => stopBenchMariadb(mariadb));
  const redis = await startBenchRedis();
  await life.add('the bench Redis', () => stopBenchRedis(redis));
  const generated = JSON.parse(readFileSync(benchStack.generatedMarker, 'utf8')) as GeneratedDatabase;
  const db = createKnex(benchDatabase);
  await life.add('the database pool', () => db.destroy());
  await migrateLatest(db);
  const today = calendarDateIn(new Date(), 'Europe/London');
  const expiryEnd = addDays(today, 60);

  for (const key of firmKeys) {
    const firm = generated.firms.find((f) => f.key === key);
    if (!firm) throw new Error(`No bench firm '${key}'.`);
    const id = firm.firmId;
    const firstPlaces = (await listActivePlaces(db, id)).slice(0, 20).map((p: { id: number }) => p.id);
    const parts: [string, () => Promise<unknown>][] = [
      ['overview: vans', () => overviewDal.listActiveVans(db, id)],
      ['overview: kit items due inputs', () => overviewDal.listItemDueInputs(db, id)],
      ['overview: expiring lots, place by place', () => listBatchesHeldExpiringBy(db, id, expiryEnd)],
      [
        'overview: expiring lots, per lot + 10 lots places',
        async () => {
          const lots = await listBatchTotalsExpiringBy(db, id, expiryEnd);
          await listPlacesHoldingBatches(
            db,
            id,
            lots.slice(0, 10).map((l) => l.batchId),
          );
          return lots;
        },
      ],
      ['booked jobs (overview, grid)', async () => (await firmBookedJobs(db, id, today)).jobs],
      ['lots in hand, whole firm', () => listBalanceRows(db, id, undefined, false)],
      ['stock levels, whole firm (overview)', () => stockLevels(db, id, today, {})],
      ['grid: products', () => listActiveProductSummaries(db, id)],
      ['grid: totals per lot over the firm', () => sumActiveBalancesByBatch(db, id)],
      ['grid: lot expiries', () => listBatchExpiries(db, id)],
      ['grid: stock levels, first 20 places', () => stockLevels(db, id, today, { locationIds: firstPlaces })],
    ];
    process.stdout.write(`${firm.name} (${key}, ${firm.movements.toLocaleString('en-GB')} movements)\n`);
    for (const [name, run] of parts) {
      const times: number[] = [];
      let rows = 0;
      for (let i = 0; i < count; i += 1) {
        const began = performance.now();
        const answer = await run();
        times.push(performance.now() - began);
        rows = Array.isArray(answer) ? answer.length : 0;
      }
      times.sort((a, b) => a - b);
      const median = times[Math.floor(times.length / 2)]!;
      process.stdout.write(`  ${name.padEnd(52)} ${median.toFixed(1).padStart(6)} ms  ${rows} rows\n`);
    }
  }
}

main().then(
  () => life.shutdown(0),
  (error: unknown) => life.shutdown(1, `read-parts stopped: ${error instanceof Error ? error.message : String(error)}`),
);
