import { z } from 'zod';

// The one place that reads process.env: parsed once, and the process fails fast on a bad value.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5173),
  APP_ORIGIN: z.url().default('http://localhost:5173'),
  TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
  // Host names the app answers to besides APP_ORIGIN's and loopback (comma-separated), e.g. a balancer's
  // own name for health checks. Any other Host gets 400 outside development (DNS rebinding).
  ALLOWED_HOSTS: z
    .string()
    .default('')
    .transform((s) =>
      s
        .split(',')
        .map((h) => h.trim().toLowerCase())
        .filter(Boolean),
    ),
  DATABASE_HOST: z.string().default('127.0.0.1'),
  DATABASE_PORT: z.coerce.number().int().default(3406),
  DATABASE_USER: z.string().default('heatfleet'),
  DATABASE_PASSWORD: z.string().default('heatfleet-local'),
  DATABASE_NAME: z.string().default('heatfleet'),
  REDIS_URL: z.string().default('redis://127.0.0.1:6479'),
  // Through Sentinel (several machines): the sentinels as host:port, comma-separated, and the name they watch the
  // master by. Then REDIS_URL gives only the password and database number, if any; its host is not used.
  REDIS_SENTINELS: z
    .string()
    .default('')
    .transform((s, ctx) => {
      const sentinels = s
        .split(',')
        .map((part) => part.trim())
        .filter(Boolean)
        .map((part) => {
          const [host = '', port = ''] = part.split(':');
          return { host, port: Number(port) };
        });
      if (sentinels.some((x) => x.host === '' || !Number.isInteger(x.port) || x.port < 1 || x.port > 65535)) {
        ctx.addIssue({ code: 'custom', message: 'REDIS_SENTINELS must be host:port pairs separated by commas.' });
      }
      return sentinels;
    }),
  REDIS_SENTINEL_NAME: z.string().default('heatfleet'),
  // Key prefix of the shared rate-limit counters (several deployments on one Redis each take their own).
  RATE_LIMIT_PREFIX: z.string().max(64).optional(),
  // Sign-ups per client address per hour (default 20). The browser tests raise it: they sign up dozens of firms
  // from one loopback address in one run.
  SIGN_UPS_PER_ADDRESS_PER_HOUR: z.coerce.number().int().min(1).max(100_000).optional(),
  // Whole-firm reads worked on at once in one API process (routes marked `heavy`); the rest queue.
  HEAVY_READS_AT_ONCE: z.coerce.number().int().min(1).max(64).default(2),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().default(2525),
  SMTP_SECURE: z.stringbool().default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Heatfleet <no-reply@heatfleet.example>'),
  SESSION_SECRET: z.string().min(32, { error: 'SESSION_SECRET must be at least 32 characters.' }),
  SESSION_IDLE_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(120),
  SESSION_ABSOLUTE_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 30)
    .default(12),
  // S3-compatible object storage for photos; the defaults point at the local stand-in of `npm start`.
  S3_ENDPOINT: z.url().optional().default('http://127.0.0.1:4569'),
  S3_REGION: z.string().default('eu-west-2'),
  S3_BUCKET: z.string().default('heatfleet-photos'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_FORCE_PATH_STYLE: z.stringbool().default(true),
  // The payment service (its official SDK). Host, port and protocol are set only to reach the local stand-in
  // (packages/payfake); production leaves them unset and the SDK uses the hosted service. README, Payments.
  STRIPE_HOST: z.string().optional(),
  STRIPE_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_PROTOCOL: z.enum(['http', 'https']).optional(),
  STRIPE_SECRET_KEY: z.string().min(1).default('sk_test_heatfleet_local'),
  STRIPE_WEBHOOK_SECRET: z.string().min(1).default('whsec_heatfleet_local'),
  // The firm's subscription: this many pence a month per active van (a price the billing module makes once).
  BILLING_VAN_PRICE_PENCE: z.coerce.number().int().min(0).max(1_000_000).default(1500),
  OUTBOX_DIR: z.string().optional(),
  WEB_DIST_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Env = z.infer<typeof envSchema>;

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Heatfleet cannot start: the environment is not valid.\n${lines.join('\n')}`);
  }
  return parsed.data;
}

let cached: Env | undefined;
export function env(): Env {
  cached ??= parseEnv();
  return cached;
}
