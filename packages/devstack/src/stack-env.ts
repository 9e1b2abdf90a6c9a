import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { databasePassword, databaseUser, getProfile, type Profile, type ProfileName } from './profiles.ts';

export const mailFrom = 'Heatfleet <no-reply@heatfleet.example>';
const s3rverCredential = 'S3RVER';
// The payment stand-in's only key and webhook secret: local values, never a real account's (README, Payments).
export const payfakeSecretKey = 'sk_test_heatfleet_local';
export const payfakeWebhookSecret = 'whsec_heatfleet_local';

/** Where the stand-in posts its events: the API's webhook route on the app's own port. */
export function payfakeWebhookUrl(profile: Profile): string {
  return `http://127.0.0.1:${profile.appPort}/api/payments/webhook`;
}

/** Made once per data folder and kept, so sessions survive a restart of `npm start`. */
function sessionSecret(dataDir: string): string {
  const file = join(dataDir, 'session-secret');
  if (existsSync(file)) {
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

/** The variables the API and worker read (apps/api/src/config/env.ts), for one profile. */
export function stackEnv(profileOrName: Profile | ProfileName): Record<string, string> {
  const profile = typeof profileOrName === 'string' ? getProfile(profileOrName) : profileOrName;
  return {
    NODE_ENV: profile.nodeEnv,
    PORT: String(profile.appPort),
    APP_ORIGIN: `http://localhost:${profile.appPort}`,
    DATABASE_HOST: '127.0.0.1',
    DATABASE_PORT: String(profile.mariadb.port),
    DATABASE_USER: databaseUser,
    DATABASE_PASSWORD: databasePassword,
    DATABASE_NAME: profile.mariadb.dbName,
    REDIS_URL: `redis://127.0.0.1:${profile.redis.port}`,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(profile.smtpPort),
    MAIL_FROM: mailFrom,
    S3_ENDPOINT: `http://127.0.0.1:${profile.s3.port}`,
    S3_REGION: profile.s3.region,
    S3_BUCKET: profile.s3.bucket,
    // s3rver accepts only this fixed key pair; a real store gets its own from the deployment's secrets.
    S3_ACCESS_KEY_ID: s3rverCredential,
    S3_SECRET_ACCESS_KEY: s3rverCredential,
    S3_FORCE_PATH_STYLE: 'true',
    // The payment SDK pointed at the local stand-in by host, port and protocol; production leaves these three unset.
    STRIPE_HOST: '127.0.0.1',
    STRIPE_PORT: String(profile.payfake.port),
    STRIPE_PROTOCOL: 'http',
    STRIPE_SECRET_KEY: payfakeSecretKey,
    STRIPE_WEBHOOK_SECRET: payfakeWebhookSecret,
    SESSION_SECRET: sessionSecret(profile.dataDir),
    OUTBOX_DIR: profile.outboxDir,
    WEB_DIST_DIR: profile.distDir,
    LOG_LEVEL: profile.logLevel,
  };
}

/** The current environment with the stack's variables (and any extras) on top, for a child process. */
export function childEnv(profile: Profile, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return { ...process.env, ...stackEnv(profile), ...extra };
}
