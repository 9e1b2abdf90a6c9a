import { apiFiles, assertFilesExist } from './api-files.ts';
import { nodeTsArgs, runStep } from './processes.ts';
import { getProfile } from './profiles.ts';
import { repoRoot } from './repo-root.ts';
import { startServices, type Services } from './services.ts';
import { childEnv } from './stack-env.ts';

// npm run db:migrate | db:make NAME | db:reset, plus `-- --test` to aim at the test profile's database.
const argv = process.argv.slice(2);
const profile = getProfile(argv.includes('--test') ? 'test' : 'dev');
const apiArgs = argv.filter((arg) => arg !== '--test');
const command = apiArgs[0];
const known = ['migrate', 'seed', 'reset', 'make'];

async function main(): Promise<number> {
  if (command === undefined || !known.includes(command)) {
    process.stderr.write(`Usage: db-cli.ts ${known.join('|')} [NAME] [--test]\n`);
    return 2;
  }
  assertFilesExist([apiFiles.dbCli]);
  // Writing a migration file needs no server.
  let services: Services | null = null;
  if (command !== 'make') services = await startServices(profile, { only: 'mariadb' });
  let interrupted = false;
  const onSignal = () => (interrupted = true);
  process.on('SIGINT', onSignal).on('SIGTERM', onSignal);
  try {
    const code = await runStep(process.execPath, nodeTsArgs(apiFiles.dbCli, apiArgs), {
      env: childEnv(profile),
      cwd: repoRoot,
    });
    return interrupted ? 130 : code;
  } finally {
    await services?.stop();
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
    process.exit(1);
  },
);
