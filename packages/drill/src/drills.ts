import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import type { Knex } from 'knex';
import { REMINDER_QUEUE } from '@heatfleet/api/jobs/reminder-worker.ts';
import { emailRetryDelayMs } from '@heatfleet/api/modules/mail/mail-queue.ts';
import type { ApiClient, Answer } from './api-client.ts';
import { checkAcks, checkBalances, checkStoredFiles, emailStates } from './checks.ts';
import { check, percent, quantile, type Check, type DrillResult } from './drill-report.ts';
import type { DrillStack } from './drill-stack.ts';
import { profile } from './drill-stack.ts';
import { answered, samplesBetween, type Sample, type SteadyLoad } from './steady-load.ts';

export interface Durations {
  mariadbDownMs: number;
  /** How long after the database's return the 99% is measured over. */
  recoveryWindowMs: number;
  objectStoreDownMs: number;
  smtpDownMs: number;
  redisDownMs: number;
  /** Redis goes down this long after the SMTP server, inside the SMTP outage. */
  redisAfterSmtpMs: number;
  invitationEveryMs: number;
  /** How long to wait, after the SMTP server is back, for every e-mail to go. */
  deliveryWaitMs: number;
}

export const fullDurations: Durations = {
  mariadbDownMs: 10_000,
  recoveryWindowMs: 30_000,
  objectStoreDownMs: 30_000,
  smtpDownMs: 10 * 60_000,
  redisDownMs: 5 * 60_000,
  redisAfterSmtpMs: 60_000,
  invitationEveryMs: 30_000,
  deliveryWaitMs: 5 * 60_000,
};

export const quickDurations: Durations = {
  mariadbDownMs: 10_000,
  recoveryWindowMs: 30_000,
  objectStoreDownMs: 10_000,
  smtpDownMs: 90_000,
  redisDownMs: 30_000,
  redisAfterSmtpMs: 10_000,
  invitationEveryMs: 10_000,
  deliveryWaitMs: 4 * 60_000,
};

export interface DrillContext {
  stack: DrillStack;
  load: SteadyLoad;
  db: Knex;
  firmId: number;
  depotId: number;
  owner: ApiClient;
  stores: ApiClient;
  durations: Durations;
  say: (line: string) => void;
}

const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

async function sleepUntil(at: number): Promise<void> {
  const wait = at - Date.now();
  if (wait > 0) await sleep(wait);
}

function statusCounts(samples: Sample[]): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const s of samples) {
    const key = s.status === 0 ? 'no answer' : String(s.status);
    counts[key] = (counts[key] ?? 0) + 1;
  }
  return counts;
}

function describeCounts(counts: Record<string, number>): string {
  return Object.entries(counts)
    .map(([status, n]) => `${n}x ${status}`)
    .join(', ');
}

function processChecks(ctx: DrillContext, apiPid: number, workerPid: number): Check[] {
  const api = ctx.stack.api!;
  const worker = ctx.stack.worker!;
  return [
    check(
      'API process stays up',
      `pid ${apiPid} running`,
      api.hasExited() ? 'the API exited' : `pid ${api.pid} running`,
      !api.hasExited() && api.pid === apiPid,
    ),
    check(
      'worker process stays up',
      `pid ${workerPid} running`,
      worker.hasExited() ? 'the worker exited' : `pid ${worker.pid} running`,
      !worker.hasExited() && worker.pid === workerPid,
    ),
  ];
}

/** The acknowledged-writes and balance checks, run after any drill that could lose a write. */
async function ledgerChecks(ctx: DrillContext): Promise<{ checks: Check[]; figures: Record<string, unknown> }> {
  const acks = await checkAcks(ctx.db, ctx.firmId, ctx.load.acks, ctx.load.keysTried);
  const balances = await checkBalances(ctx.db);
  return {
    checks: [
      check(
        'acknowledged writes are in the database',
        'all, as answered',
        `${acks.acknowledged - acks.missing.length} of ${acks.acknowledged} (${acks.replayed} answered by an idempotent replay)${acks.missing.length ? `; missing: ${acks.missing.slice(0, 3).join(', ')}` : ''}`,
        acks.missing.length === 0 && acks.acknowledged > 0,
      ),
      check(
        'no write applied twice',
        '0 keys with two groups',
        `${acks.duplicated.length} of ${acks.keysTried} keys`,
        acks.duplicated.length === 0,
      ),
      check(
        'every balance equals its ledger',
        '0 mismatches',
        `${balances.mismatched.length} of ${balances.balances} balances${balances.mismatched.length ? `: ${balances.mismatched.slice(0, 3).join('; ')}` : ''}`,
        balances.mismatched.length === 0,
      ),
    ],
    figures: { acks, balances },
  };
}

export async function mariadbDrill(ctx: DrillContext): Promise<DrillResult> {
  const d = ctx.durations;
  const startedAt = Date.now();
  const apiPid = ctx.stack.api!.pid;
  const workerPid = ctx.stack.worker!.pid;
  ctx.say(`MariaDB: SIGKILL now, back in ${seconds(d.mariadbDownMs)}…`);
  const killedAt = Date.now();
  await ctx.stack.killMariadb();
  await sleepUntil(killedAt + d.mariadbDownMs);
  const restartAt = Date.now();
  await ctx.stack.startMariadb();
  const backAt = Date.now();
  ctx.say(
    `MariaDB: back after ${seconds(backAt - killedAt)} (restart and crash recovery took ${seconds(backAt - restartAt)}); measuring ${seconds(d.recoveryWindowMs)}…`,
  );
  await sleep(d.recoveryWindowMs);
  // Requests still open at the end of the window are counted once they answer.
  await sleep(5_000);

  const during = samplesBetween(ctx.load.samples, killedAt, restartAt);
  const answeredWhileDown = during.filter((s) => s.end < backAt);
  const slow = during.filter((s) => s.end - s.start > 5_000);
  const non503WhileDown = answeredWhileDown.filter((s) => s.status !== 503);
  const after = samplesBetween(ctx.load.samples, backAt, backAt + d.recoveryWindowMs);
  const afterOk = after.filter((s) => answered(s.status));
  const firstOk = after.find((s) => s.status >= 200 && s.status < 300);
  const ledger = await ledgerChecks(ctx);
  const latencies = during.map((s) => s.end - s.start);
  return {
    drill: 'MariaDB killed',
    outage: `SIGKILL, restarted after ${seconds(d.mariadbDownMs)}`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      ...processChecks(ctx, apiPid, workerPid),
      check(
        'requests while down answer 503',
        'every one answered while down',
        `${answeredWhileDown.length - non503WhileDown.length} of ${answeredWhileDown.length} were 503 (${describeCounts(statusCounts(answeredWhileDown))})`,
        answeredWhileDown.length > 0 && non503WhileDown.length === 0,
      ),
      check(
        '... and within 5 s',
        'slowest under 5 s',
        `slowest ${seconds(Math.max(0, ...latencies))}, p50 ${seconds(quantile(latencies, 0.5))}; ${slow.length} over 5 s`,
        slow.length === 0,
      ),
      check(
        `succeed within ${seconds(d.recoveryWindowMs)} of its return`,
        '>= 99%',
        `${percent(afterOk.length, after.length)} of ${after.length} (${describeCounts(statusCounts(after))}); first 2xx ${firstOk ? seconds(firstOk.end - backAt) : 'never'} after`,
        after.length > 0 && afterOk.length / after.length >= 0.99,
      ),
      ...ledger.checks,
    ],
    figures: {
      downMs: restartAt - killedAt,
      restartMs: backAt - restartAt,
      requestsWhileDown: during.length,
      statusesWhileDown: statusCounts(during),
      maxLatencyWhileDownMs: Math.max(0, ...latencies),
      requestsInRecoveryWindow: after.length,
      succeededInRecoveryWindow: afterOk.length,
      firstSuccessAfterReturnMs: firstOk ? firstOk.end - backAt : null,
      ...ledger.figures,
    },
  };
}

// A 1x1 PNG and the smallest file file-type takes for a PDF: invented content, only the bytes' type matters.
const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);
const tinyPdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');

function uploadPhoto(client: ApiClient): Promise<Answer> {
  const form = new FormData();
  form.set('caption', 'Drill photo');
  form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'drill.png');
  return client.send('POST', '/api/photos', { form });
}

function uploadDataSheet(client: ApiClient, productId: number): Promise<Answer> {
  const form = new FormData();
  form.set('file', new Blob([tinyPdf], { type: 'application/pdf' }), 'drill-sheet.pdf');
  return client.send('POST', `/api/products/${productId}/safety-data-sheet`, { form });
}

export async function objectStoreDrill(ctx: DrillContext, productId: number): Promise<DrillResult> {
  const d = ctx.durations;
  const startedAt = Date.now();
  const apiPid = ctx.stack.api!.pid;
  const workerPid = ctx.stack.worker!.pid;
  const before = [await uploadPhoto(ctx.stores), await uploadDataSheet(ctx.stores, productId)];
  const rowsBefore = Number(((await ctx.db('photos').count({ n: '*' }).first()) as { n: number }).n);
  ctx.say(`Object storage: down for ${seconds(d.objectStoreDownMs)}, uploading meanwhile…`);
  await ctx.stack.stopObjectStore();
  const downAt = Date.now();
  const during: { kind: string; answer: Answer }[] = [];
  while (Date.now() < downAt + d.objectStoreDownMs) {
    during.push({ kind: 'photo', answer: await uploadPhoto(ctx.stores) });
    during.push({ kind: 'data sheet', answer: await uploadDataSheet(ctx.stores, productId) });
    await sleep(1_000);
  }
  const rowsDuring = Number(((await ctx.db('photos').count({ n: '*' }).first()) as { n: number }).n);
  await ctx.stack.startObjectStore();
  const after = [await uploadPhoto(ctx.stores), await uploadDataSheet(ctx.stores, productId)];
  const files = await checkStoredFiles(ctx.db, ctx.stack.env);

  const refused = during.filter((u) => u.answer.status === 503);
  const message = (refused[0]?.answer.body as { message?: string } | undefined)?.message ?? '(none)';
  const plain = refused.every((u) => {
    const body = u.answer.body as { error?: string; message?: string } | null;
    return (
      body?.error === 'ServiceUnavailable' &&
      /file storage/.test(body.message ?? '') &&
      !/ECONN|S3|stack|Error:/.test(body.message ?? '')
    );
  });
  const retryAfter = refused.length > 0;
  const slowest = Math.max(0, ...during.map((u) => u.answer.ms));
  return {
    drill: 'Object storage down',
    outage: `s3rver closed for ${seconds(d.objectStoreDownMs)}`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      ...processChecks(ctx, apiPid, workerPid),
      check(
        'uploads before the outage',
        '2 stored',
        before.map((a) => a.status).join(', '),
        before.every((a) => a.status === 200 || a.status === 201),
      ),
      check(
        'uploads while down answer 503',
        'every one',
        `${refused.length} of ${during.length} (${during
          .map((u) => u.answer.status)
          .filter((s, i, all) => all.indexOf(s) === i)
          .join(', ')}), slowest ${seconds(slowest)}`,
        retryAfter && refused.length === during.length,
      ),
      check('... in plain words', 'error body, no internals', `"${message}"`, plain && refused.length > 0),
      check('no row written while down', `${rowsBefore} photo rows`, `${rowsDuring}`, rowsDuring === rowsBefore),
      check(
        'uploads after its return',
        '2 stored',
        after.map((a) => a.status).join(', '),
        after.every((a) => a.status === 200 || a.status === 201),
      ),
      check(
        'no row points at a missing file',
        '0 missing',
        `${files.missing.length} of ${files.rows} photo and data-sheet rows`,
        files.missing.length === 0,
      ),
    ],
    figures: {
      uploadsWhileDown: during.length,
      refused: refused.length,
      slowestMs: slowest,
      message,
      storedFileRows: files.rows,
      missingFiles: files.missing,
    },
  };
}

interface Invitation {
  email: string;
  status: number;
  at: number;
}

/**
 * The SMTP outage, with the Redis outage inside it: invitations (e-mails) are written all through the SMTP
 * outage; while Redis is down, kit items fall due and the reminder scan runs; after Redis returns, the
 * scheduler's sweep runs as on a new day. The two are reported separately.
 */
export async function smtpAndRedisDrills(ctx: DrillContext): Promise<[DrillResult, DrillResult]> {
  const d = ctx.durations;
  const startedAt = Date.now();
  const apiPid = ctx.stack.api!.pid;
  const workerPid = ctx.stack.worker!.pid;
  const lastEmailId = Number(((await ctx.db('emails').max({ id: 'id' }).first()) as { id: number | null }).id ?? 0);

  ctx.say(
    `SMTP: down for ${seconds(d.smtpDownMs)}; Redis goes down ${seconds(d.redisAfterSmtpMs)} in, for ${seconds(d.redisDownMs)}…`,
  );
  await ctx.stack.stopMail();
  const smtpDownAt = Date.now();
  const invitations: Invitation[] = [];
  let inviting = true;
  const invitingLoop = (async () => {
    let n = 0;
    while (inviting) {
      n += 1;
      const email = `drill-invitee-${startedAt.toString(36)}-${n}@drill.example`;
      const answer = await ctx.owner.post('/api/invitations', { email, role: 'engineer' });
      invitations.push({ email, status: answer.status, at: Date.now() });
      const next = smtpDownAt + n * d.invitationEveryMs;
      while (inviting && Date.now() < next) await sleep(250);
    }
  })();

  await sleepUntil(smtpDownAt + d.redisAfterSmtpMs);
  await ctx.stack.stopRedis();
  const redisDownAt = Date.now();
  ctx.say('Redis: stopped; making kit items due and scanning…');
  await sleep(3_000);
  const kind = (await ctx
    .db('item_kinds')
    .where({ firm_id: ctx.firmId })
    .whereNotNull('interval_days')
    .orderBy('id')
    .first('id', 'name')) as { id: number; name: string } | undefined;
  if (!kind) throw new Error('The demo firm has no item kind with an inspection interval.');
  const tag = `D${(startedAt % 1_000_000).toString(36).toUpperCase()}`;
  const makeItem = async (label: string) => {
    const answer = await ctx.owner.post('/api/kit-items', {
      assetTag: `${tag}-${label}`,
      kindId: kind.id,
      locationId: ctx.depotId,
      inServiceSince: '2024-01-02',
    });
    return { label, status: answer.status, id: (answer.body as { item?: { id: number } } | null)?.item?.id ?? null };
  };
  const scannedNow = [await makeItem('S1'), await makeItem('S2'), await makeItem('S3')];
  const scan = await ctx.owner.post('/api/reminders/scan', {});
  const forTheSweep = [await makeItem('W1'), await makeItem('W2')];
  const items = [...scannedNow, ...forTheSweep];

  await sleepUntil(redisDownAt + d.redisDownMs);
  await ctx.stack.startRedis();
  const redisBackAt = Date.now();
  ctx.say(`Redis: back after ${seconds(redisBackAt - redisDownAt)}; running the scheduler's sweep…`);
  // As the hourly scheduler does on the next day: the firm's scan hour has come and today is not yet scanned.
  await ctx.db('reminder_settings').where({ firm_id: ctx.firmId }).update({ last_scan_on: null, scan_hour: 0 });
  const sweeps = await runSweeps(2);
  const redisWindow = samplesBetween(ctx.load.samples, redisDownAt, redisBackAt);
  const redisWindowOk = redisWindow.filter((s) => answered(s.status));

  await sleepUntil(smtpDownAt + d.smtpDownMs);
  await ctx.stack.startMail();
  const smtpBackAt = Date.now();
  inviting = false;
  await invitingLoop;
  ctx.say(
    `SMTP: back after ${seconds(smtpBackAt - smtpDownAt)}; waiting for every e-mail to go (up to ${seconds(d.deliveryWaitMs)})…`,
  );
  const newer = (q: Knex.QueryBuilder) => void q.where('id', '>', lastEmailId);
  let states = await emailStates(ctx.db, profile.outboxDir, newer);
  while (Date.now() < smtpBackAt + d.deliveryWaitMs && states.some((s) => s.sentAt === null || s.caught === 0)) {
    await sleep(2_000);
    states = await emailStates(ctx.db, profile.outboxDir, newer);
  }
  const settledAt = Date.now();

  // The SMTP drill: every e-mail written while the SMTP server was down.
  const written = states.filter((s) => s.createdAt >= smtpDownAt && s.createdAt < smtpBackAt);
  const sent = written.filter((s) => s.sentAt !== null);
  const caughtOnce = written.filter((s) => s.caught === 1);
  const twice = states.filter((s) => s.caught > 1);
  const delays = sent.map((s) => s.sentAt! - smtpBackAt);
  const attempts = written.map((s) => s.attempts);
  const invitesOk = invitations.filter((i) => i.status === 201);
  const retries = retryRun(smtpDownAt);
  const smtpChecks = [
    ...processChecks(ctx, apiPid, workerPid),
    check(
      'invitations accepted while SMTP down',
      'all 201',
      `${invitesOk.length} of ${invitations.length}`,
      invitations.length > 0 && invitesOk.length === invitations.length,
    ),
    check(
      'no e-mail lost',
      'all written are sent',
      `${sent.length} of ${written.length} sent (${written.filter((s) => s.purpose === 'invitation').length} invitations, ${written.filter((s) => s.purpose === 'reminder').length} reminders)`,
      written.length > 0 && sent.length === written.length,
    ),
    check(
      'retried with backoff meanwhile',
      'gaps 5, 10, 20, 40, 80, 120 s...',
      `${retries.jobs} jobs failed and waited; one job's gaps: ${retries.gapsS.join(', ')} s (${retries.onSchedule} on schedule; one spanning the Redis outage is longer); failed attempts per e-mail up to ${Math.max(0, ...attempts)}`,
      retries.onSchedule >= 3,
    ),
    check(
      'delivered after it returns',
      'within 2 min 30 s',
      `all within ${seconds(Math.max(0, ...delays))} (median ${seconds(quantile(delays, 0.5))})`,
      delays.length === written.length && Math.max(0, ...delays) <= 150_000,
    ),
    check(
      'each received once',
      'once each, none twice',
      `${caughtOnce.length} of ${written.length} once; ${twice.length} e-mails caught twice or more`,
      caughtOnce.length === written.length && twice.length === 0,
    ),
  ];

  // The Redis drill: the reminders that fell due while it was down.
  const itemIds = items.map((i) => i.id).filter((id): id is number => id !== null);
  const reminders = (await ctx
    .db('reminders')
    .where({ firm_id: ctx.firmId, subject_type: 'kit_item' })
    .whereIn('subject_id', itemIds)
    .select('id', 'subject_id', 'created_at')) as { id: number; subject_id: number; created_at: Date }[];
  const deliveries = (await ctx
    .db('reminder_deliveries')
    .whereIn(
      'reminder_id',
      reminders.map((r) => r.id),
    )
    .select('reminder_id', 'email_id', 'recipient')) as { reminder_id: number; email_id: number; recipient: string }[];
  const reminderEmailIds = [...new Set(deliveries.map((r) => r.email_id))];
  const reminderEmails = states.filter((s) => reminderEmailIds.includes(s.id));
  const perItem = itemIds.map((id) => reminders.filter((r) => r.subject_id === id).length);
  const reminderDelays = reminderEmails.filter((s) => s.sentAt !== null).map((s) => s.sentAt! - redisBackAt);
  const scanBody = scan.body as { sent?: number } | null;
  const createdAt = new Map(reminders.map((r) => [r.subject_id, r.created_at.getTime()]));
  const reminderBefore = (id: number) => (createdAt.get(id) ?? Infinity) < redisBackAt;
  const reminderAfter = (id: number) => (createdAt.get(id) ?? 0) >= redisBackAt;
  const scannedIds = scannedNow.map((i) => i.id).filter((id): id is number => id !== null);
  const sweptIds = forTheSweep.map((i) => i.id).filter((id): id is number => id !== null);
  const redisChecks = [
    ...processChecks(ctx, apiPid, workerPid),
    check(
      'routes without Redis keep working',
      '>= 99% of the steady load',
      `${percent(redisWindowOk.length, redisWindow.length)} of ${redisWindow.length} (${describeCounts(statusCounts(redisWindow))})`,
      redisWindow.length > 0 && redisWindowOk.length / redisWindow.length >= 0.99,
    ),
    check(
      'kit items made due while down',
      '5 created (201)',
      items.map((i) => i.status).join(', '),
      items.every((i) => i.status === 201),
    ),
    check(
      '"scan now" while down',
      "200, the 3 items' reminders recorded",
      `${scan.status}, ${scanBody?.sent ?? '?'} new in the firm; ${scannedIds.filter((id) => reminderBefore(id)).length} of 3 items`,
      scan.status === 200 && scannedIds.length === 3 && scannedIds.every(reminderBefore),
    ),
    check(
      'scheduler sweep after its return',
      'the other 2 items, then nothing new',
      `items reminded by the sweep: ${sweptIds.filter(reminderAfter).length} of 2; sweeps: ${sweeps.map((w) => `${w.state} (${w.reminders ?? '?'} new)`).join(', ')}`,
      sweptIds.length === 2 &&
        sweptIds.every(reminderAfter) &&
        sweeps.length === 2 &&
        sweeps.every((w) => w.state === 'completed') &&
        sweeps[1]?.reminders === 0,
    ),
    check(
      'one reminder per item and period',
      '1 each',
      perItem.join(', '),
      perItem.length === 5 && perItem.every((n) => n === 1),
    ),
    check(
      'reminder e-mails all sent after it returns',
      'all sent, none twice',
      `${reminderEmails.filter((s) => s.sentAt !== null).length} of ${reminderEmails.length} sent, ${deliveries.length} deliveries; caught ${reminderEmails.map((s) => s.caught).join(',')} times; first ${seconds(Math.min(...reminderDelays))} after Redis returned (SMTP was down until ${seconds(smtpBackAt - redisBackAt)} after)`,
      reminderEmails.length > 0 &&
        reminderEmails.every((s) => s.sentAt !== null && s.sentAt >= redisBackAt && s.caught === 1),
    ),
  ];

  const finished = new Date(settledAt).toISOString();
  return [
    {
      drill: 'SMTP server down',
      outage: `mail catcher closed for ${seconds(smtpBackAt - smtpDownAt)} (Redis was also down for ${seconds(redisBackAt - redisDownAt)} inside it)`,
      startedAt: new Date(smtpDownAt).toISOString(),
      seconds: Math.round((settledAt - smtpDownAt) / 1000),
      checks: smtpChecks,
      figures: {
        emailsWritten: written.length,
        sent: sent.length,
        invitations: invitations.length,
        attempts,
        retries,
        deliveryAfterReturnMs: delays,
        settledAt: finished,
      },
    },
    {
      drill: 'Redis stopped',
      outage: `redis-server shut down for ${seconds(redisBackAt - redisDownAt)} (inside the SMTP outage)`,
      startedAt: new Date(redisDownAt).toISOString(),
      seconds: Math.round((settledAt - redisDownAt) / 1000),
      checks: redisChecks,
      figures: {
        requestsWhileDown: redisWindow.length,
        statusesWhileDown: statusCounts(redisWindow),
        items,
        scan: { status: scan.status, body: scan.body },
        sweeps,
        reminders: reminders.length,
        deliveries: deliveries.length,
        reminderEmailDelaysAfterRedisMs: reminderDelays,
      },
    },
  ];
}

/**
 * The worker logs each failed delivery job with its time: the gaps between one job's failures are its
 * backoff as it happened. Picks the job whose gaps follow the schedule best (a gap spanning the Redis
 * outage is longer than planned, as the worker could not run meanwhile).
 */
function retryRun(since: number): { jobs: number; gapsS: number[]; expectedS: number[]; onSchedule: number } {
  const byJob = new Map<string, number[]>();
  let text: string;
  try {
    text = readFileSync(join(profile.logDir, 'worker.log'), 'utf8');
  } catch {
    return { jobs: 0, gapsS: [], expectedS: [], onSchedule: 0 };
  }
  for (const line of text.split('\n')) {
    if (!line.includes('e-mail job failed')) continue;
    try {
      const entry = JSON.parse(line) as { time: number; jobId?: string };
      if (entry.time < since || entry.jobId === undefined) continue;
      byJob.set(entry.jobId, [...(byJob.get(entry.jobId) ?? []), entry.time]);
    } catch {
      // the last line may still be being written
    }
  }
  let best = { jobs: byJob.size, gapsS: [] as number[], expectedS: [] as number[], onSchedule: 0 };
  for (const times of byJob.values()) {
    const gapsS = times.slice(1).map((t, i) => Math.round((t - times[i]!) / 100) / 10);
    const expectedS = gapsS.map((_, i) => emailRetryDelayMs(i + 1) / 1000);
    const onSchedule = gapsS.filter((gap, i) => Math.abs(gap - expectedS[i]!) < 2).length;
    if (onSchedule > best.onSchedule || (onSchedule === best.onSchedule && gapsS.length > best.gapsS.length))
      best = { jobs: byJob.size, gapsS, expectedS, onSchedule };
  }
  return best;
}

/** Queues the reminder sweep as the hourly scheduler does and waits for each run's result. */
async function runSweeps(times: number): Promise<{ state: string; firms?: number; reminders?: number }[]> {
  const connection = new Redis(`redis://127.0.0.1:${profile.redis.port}`, { maxRetriesPerRequest: null });
  const queue = new Queue(REMINDER_QUEUE, { connection });
  const results: { state: string; firms?: number; reminders?: number }[] = [];
  try {
    for (let i = 0; i < times; i += 1) {
      const job = await queue.add('sweep', {}, { removeOnComplete: 100, removeOnFail: 100 });
      const deadline = Date.now() + 60_000;
      let state = await job.getState();
      while (state !== 'completed' && state !== 'failed' && Date.now() < deadline) {
        await sleep(250);
        state = await job.getState();
      }
      const done = await queue.getJob(job.id!);
      const value = done?.returnvalue as { firms?: number; reminders?: number } | undefined;
      results.push({ state, ...value });
    }
  } finally {
    await queue.close();
    connection.disconnect();
  }
  return results;
}
