import { join, relative } from 'node:path';
import { apiFiles, assertFilesExist, toolFiles } from './api-files.ts';
import { demoAccounts, demoPassword } from './demo-accounts.ts';
import { Lifecycle } from './lifecycle.ts';
import {
  assertPortsFree,
  httpAnswers200,
  nodeTsArgs,
  runStep,
  startService,
  waitUntil,
  type Service,
} from './processes.ts';
import { databasePassword, databaseUser, getProfile } from './profiles.ts';
import { repoRoot } from './repo-root.ts';
import { startServices } from './services.ts';
import { childEnv } from './stack-env.ts';

const devMode = process.argv.slice(2).includes('--dev');
const profile = getProfile('dev');
const life = new Lifecycle();
life.handleSignals(0);
const began = Date.now();

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

async function step(title: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  life.assertRunning();
  say(`${title}…`);
  const code = await runStep(process.execPath, args, { env, cwd: repoRoot });
  life.assertRunning();
  if (code !== 0) throw new Error(`${title} failed (exit ${code}).`);
}

function launch(name: string, args: string[], env: NodeJS.ProcessEnv): Service {
  life.assertRunning();
  const service = startService({
    name,
    command: process.execPath,
    args,
    env,
    logFile: join(profile.logDir, `${name}.log`),
  });
  life.watch(service);
  return service;
}

async function waitForHealth(url: string, service: Service): Promise<void> {
  await waitUntil(`${url}`, () => httpAnswers200(url), {
    timeoutMs: 90_000,
    intervalMs: 200,
    failEarly: () => (service.hasExited() || life.stopping ? `${service.name} is not running` : null),
  });
}

function printBanner(apiPort: number): void {
  const url = `http://localhost:${profile.appPort}`;
  const lines = [
    '',
    `Heatfleet is running at ${url}${devMode ? '  (Vite dev server with hot reload)' : ''}`,
    `  ready in ${((Date.now() - began) / 1000).toFixed(1)} s`,
    `  data folder ${relative(process.cwd(), profile.dataDir) || profile.dataDir} (kept between runs; npm run db:reset starts afresh)`,
    `  MariaDB     127.0.0.1:${profile.mariadb.port}, database ${profile.mariadb.dbName}, user ${databaseUser} / ${databasePassword}`,
    `  Redis       127.0.0.1:${profile.redis.port}`,
    `  Mail        SMTP 127.0.0.1:${profile.smtpPort}, nothing is delivered: read it at ${url}/outbox`,
    `  Photos      S3 http://127.0.0.1:${profile.s3.port}, bucket ${profile.s3.bucket}, files in ${relative(process.cwd(), profile.s3.dataDir) || profile.s3.dataDir}`,
    `  Payments    a local stand-in at http://127.0.0.1:${profile.payfake.port} (card 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)`,
    devMode ? `  API         http://127.0.0.1:${apiPort} (Vite proxies /api to it)` : `  API         ${url}/api`,
    `  logs        ${relative(process.cwd(), profile.logDir) || profile.logDir}`,
    '',
    `Demo sign-ins, all with the password ${demoPassword}:`,
    ...demoAccounts.map((account) => `  ${account.email.padEnd(30)} ${account.role}`),
    '',
    'Ctrl-C stops everything.',
  ];
  say(lines.join('\n'));
}

async function main(): Promise<void> {
  assertFilesExist([apiFiles.dbCli, apiFiles.server, apiFiles.worker, toolFiles.vite]);
  const apiPort = devMode ? profile.appPort + 1 : profile.appPort;
  await assertPortsFree([
    { port: profile.appPort, what: devMode ? 'the Vite dev server' : 'Heatfleet' },
    ...(devMode ? [{ port: apiPort, what: 'the API behind Vite' }] : []),
    { port: profile.smtpPort, what: 'the mail catcher' },
    { port: profile.s3.port, what: 'the S3 object store' },
    { port: profile.payfake.port, what: 'the payment stand-in' },
  ]);

  const services = await startServices(profile, { log: say });
  await life.add('MariaDB, Redis, the mail catcher, the object store and the payment stand-in', () => services.stop());

  const env = childEnv(profile, { PORT: String(apiPort) });
  await step('Migrating the database', nodeTsArgs(apiFiles.dbCli, ['migrate']), env);
  await step('Seeding the demo firms (only the first time)', nodeTsArgs(apiFiles.dbCli, ['seed']), env);
  if (!devMode) {
    // A development NODE_ENV would make Vite bundle React's development build.
    const buildEnv = { ...process.env, NODE_ENV: 'production' };
    const buildBegan = Date.now();
    await step(
      'Building the client',
      [toolFiles.vite, 'build', '--outDir', profile.distDir, '--emptyOutDir', '--logLevel', 'warn'],
      buildEnv,
    );
    say(`Built in ${((Date.now() - buildBegan) / 1000).toFixed(1)} s (npm run build shows the bundle sizes).`);
  }

  const server = launch('api', nodeTsArgs(apiFiles.server), env);
  launch('worker', nodeTsArgs(apiFiles.worker), env);
  await waitForHealth(`http://127.0.0.1:${apiPort}/api/health`, server);

  if (devMode) {
    const vite = launch(
      'vite',
      [toolFiles.vite, '--port', String(profile.appPort), '--strictPort'],
      childEnv(profile, { PORT: String(profile.appPort), API_PROXY_TARGET: `http://127.0.0.1:${apiPort}` }),
    );
    await waitForHealth(`http://localhost:${profile.appPort}/api/health`, vite);
  }
  life.assertRunning();
  printBanner(apiPort);
}

main().catch((error: unknown) => {
  if (life.stopping) return;
  void life.shutdown(1, `npm start stopped: ${error instanceof Error ? error.message : String(error)}`);
});
