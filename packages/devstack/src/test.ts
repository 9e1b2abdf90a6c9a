import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { join, relative } from 'node:path';
import { apiFiles, assertFilesExist, toolFiles } from './api-files.ts';
import { Lifecycle } from './lifecycle.ts';
import { ensureDatabase } from './mariadb.ts';
import { assertPortsFree, httpAnswers200, nodeTsArgs, runStep, startService, waitUntil } from './processes.ts';
import { getProfile } from './profiles.ts';
import { flushRedis } from './redis.ts';
import { repoRoot } from './repo-root.ts';
import { startServices } from './services.ts';
import { childEnv } from './stack-env.ts';
import { addCounts, countPlaywright, countVitest, readReport, summaryLine, type Counts } from './test-summary.ts';

// Ours: --e2e (browser tests even with a vitest filter), --e2e-only, --no-e2e, and tests/e2e/<file> (only those
// browser files). Anything else goes to vitest.
const ownFlags = new Set(['--e2e', '--e2e-only', '--no-e2e']);
const argv = process.argv.slice(2);
// A path under tests/e2e/ picks browser test files (only those run) and is not passed to vitest.
const isBrowserFile = (arg: string) => arg.replace(/^\.\//, '').startsWith('tests/e2e/');
const e2eFiles = argv.filter(isBrowserFile);
const vitestArgs = argv.filter((arg) => !ownFlags.has(arg) && !isBrowserFile(arg));
const runVitest = !argv.includes('--e2e-only') && !(e2eFiles.length > 0 && vitestArgs.length === 0);
const wantE2e =
  argv.includes('--e2e-only') ||
  argv.includes('--e2e') ||
  e2eFiles.length > 0 ||
  (!argv.includes('--no-e2e') && vitestArgs.length === 0);

const profile = getProfile('test');
const vitestJson = join(profile.dataDir, 'vitest.json');
const playwrightJson = join(profile.dataDir, 'playwright.json');
const results: Counts[] = [];
const problems: string[] = [];

const life = new Lifecycle();
life.finalLine = () => {
  for (const problem of problems) process.stdout.write(`Problem: ${problem}\n`);
  return summaryLine(addCounts(...results));
};
life.handleSignals(130, () => problems.push('interrupted'));

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

function heading(title: string): void {
  say(`\n== ${title}`);
}

async function step(title: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  life.assertRunning();
  say(`${title}…`);
  const code = await runStep(process.execPath, args, { env, cwd: repoRoot });
  life.assertRunning();
  if (code !== 0) throw new Error(`${title} failed (exit ${code}).`);
}

function clearOutbox(): void {
  rmSync(profile.outboxDir, { recursive: true, force: true });
  mkdirSync(profile.outboxDir, { recursive: true });
}

async function freshDatabase(env: NodeJS.ProcessEnv, seed: boolean): Promise<void> {
  say(`Recreating database ${profile.mariadb.dbName}…`);
  await ensureDatabase(profile.mariadb, { dbName: profile.mariadb.dbName, recreate: true });
  await flushRedis(profile.redis);
  clearOutbox();
  await step('Migrating', nodeTsArgs(apiFiles.dbCli, ['migrate']), env);
  if (seed) await step('Seeding the demo firms', nodeTsArgs(apiFiles.dbCli, ['seed']), env);
}

async function vitestPhase(env: NodeJS.ProcessEnv): Promise<void> {
  heading(`vitest ${vitestArgs.join(' ')}`.trim());
  life.assertRunning();
  const code = await runStep(
    process.execPath,
    [
      toolFiles.vitest,
      'run',
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${vitestJson}`,
      // The browser tests belong to Playwright; vitest's default glob would pick them up too.
      '--exclude=tests/e2e/**',
      '--exclude=.data/**',
      ...vitestArgs,
    ],
    { env, cwd: repoRoot },
  );
  life.assertRunning();
  const counts = readReport(vitestJson, countVitest);
  if (counts === null) problems.push(`vitest wrote no report (${vitestJson}); it exited with code ${code}`);
  else {
    results.push(counts);
    if (code !== 0 && counts.failed === 0)
      problems.push(`vitest exited with code ${code} although no test failed: see its errors above`);
  }
  if (code !== 0 && counts === null) results.push({ passed: 0, failed: 1, skipped: 0 });
}

async function e2ePhase(env: NodeJS.ProcessEnv): Promise<void> {
  heading('Playwright (browser tests)');
  if (!existsSync(toolFiles.playwrightConfig)) {
    say('No playwright.config.ts at the repository root yet: skipping the browser tests.');
    return;
  }
  // The browser tests build their own firms through the API; the demo seed is for npm start.
  await freshDatabase(env, false);
  const server = startService({
    name: 'api',
    command: process.execPath,
    args: nodeTsArgs(apiFiles.server),
    // Every browser test signs up its own firm from 127.0.0.1: more than the 20 an hour one address may.
    env: { ...env, SIGN_UPS_PER_ADDRESS_PER_HOUR: '1000' },
    logFile: join(profile.logDir, 'api.log'),
    quiet: true,
  });
  life.watch(server);
  const worker = startService({
    name: 'worker',
    command: process.execPath,
    args: nodeTsArgs(apiFiles.worker),
    env,
    logFile: join(profile.logDir, 'worker.log'),
    quiet: true,
  });
  life.watch(worker);
  const health = `http://127.0.0.1:${profile.appPort}/api/health`;
  await waitUntil(health, () => httpAnswers200(health), {
    timeoutMs: 90_000,
    intervalMs: 200,
    failEarly: () => (server.hasExited() ? 'the API server exited' : null),
  });
  life.assertRunning();
  const baseUrl = `http://localhost:${profile.appPort}`;
  say(`App up at ${baseUrl} (API and worker logs in ${relative(repoRoot, profile.logDir)}/); running Playwright…`);
  const code = await runStep(
    process.execPath,
    [toolFiles.playwright, 'test', '--config', toolFiles.playwrightConfig, ...e2eFiles],
    {
      env: {
        ...env,
        BASE_URL: baseUrl,
        PLAYWRIGHT_JSON: playwrightJson,
        PLAYWRIGHT_JSON_OUTPUT_FILE: playwrightJson,
        PLAYWRIGHT_ARTIFACTS: join(profile.dataDir, 'playwright-artifacts'),
      },
      cwd: repoRoot,
    },
  );
  life.assertRunning();
  const counts = readReport(playwrightJson, countPlaywright);
  if (counts === null) {
    problems.push(
      `Playwright wrote no json report at ${playwrightJson} (exit ${code}); does playwright.config.ts use PLAYWRIGHT_JSON?`,
    );
    results.push({ passed: 0, failed: 1, skipped: 0 });
  } else {
    results.push(counts);
    if (code !== 0 && counts.failed === 0) problems.push(`Playwright exited with code ${code} although no test failed`);
  }
  // Stopped here rather than at the end, so their shutdown lines come before the summary.
  await Promise.all([server.stop(), worker.stop()]);
}

async function main(): Promise<void> {
  assertFilesExist([
    apiFiles.dbCli,
    toolFiles.vitest,
    ...(wantE2e ? [apiFiles.server, apiFiles.worker, toolFiles.vite, toolFiles.playwright] : []),
  ]);
  await assertPortsFree([
    ...(wantE2e ? [{ port: profile.appPort, what: 'the test app' }] : []),
    { port: profile.smtpPort, what: 'the test mail catcher' },
    { port: profile.s3.port, what: 'the test S3 object store' },
    { port: profile.payfake.port, what: 'the test payment stand-in' },
  ]);
  rmSync(vitestJson, { force: true });
  rmSync(playwrightJson, { force: true });

  heading('Test stack');
  // The database is recreated each run, so last run's photo objects would belong to rows that no longer exist.
  rmSync(profile.s3.dataDir, { recursive: true, force: true });
  const services = await startServices(profile, { log: say });
  await life.add('MariaDB, Redis, the mail catcher and the object store', () => services.stop());
  const env = childEnv(profile);

  await freshDatabase(env, false);
  if (wantE2e) {
    await step(
      'Building the client',
      [toolFiles.vite, 'build', '--outDir', profile.distDir, '--emptyOutDir', '--logLevel', 'warn'],
      {
        ...process.env,
        NODE_ENV: 'production',
      },
    );
  }
  if (runVitest) await vitestPhase(env);
  else say('--e2e-only: vitest skipped.');
  if (wantE2e) await e2ePhase(env);
  else say('\nBrowser tests skipped (a vitest filter or --no-e2e was given; add --e2e to run them as well).');
  const failed = addCounts(...results).failed > 0 || problems.length > 0;
  await life.shutdown(failed ? 1 : 0);
}

main().catch((error: unknown) => {
  if (life.stopping) return;
  const message = error instanceof Error ? error.message : String(error);
  problems.push(message);
  void life.shutdown(1);
});
