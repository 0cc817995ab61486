import { z } from 'zod';

/**
 * Typed configuration from the environment, checked once at start-up: a bad value stops the
 * process at once with a message naming the variable. Defaults match ops/lib/env.sh and .env.example.
 */
/** The development session secret (.env.example and the default below); refused in production. */
const DEV_SESSION_SECRET = 'change-me-in-production-please-0123456789';

const bool = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  RILLMARK_DB_HOST: z.string().default('127.0.0.1'),
  RILLMARK_DB_PORT: z.coerce.number().int().min(1).max(65535).default(3317),
  RILLMARK_DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/)
    .default('rillmark'),
  RILLMARK_DB_USER: z.string().default('rillmark'),
  RILLMARK_DB_PASSWORD: z.string().default('rillmark-dev-password'),
  RILLMARK_DB_POOL_SIZE: z.coerce.number().int().min(1).max(200).default(20),
  // Upper bound for one SQL statement (LOAD DATA of an upload excepted); requests meet a stalled MariaDB much
  // sooner through the database watch (503 within about two seconds).
  RILLMARK_DB_QUERY_TIMEOUT_MS: z.coerce.number().int().min(1_000).max(3_600_000).default(30_000),
  RILLMARK_PORT: z.coerce.number().int().min(0).max(65535).default(4280),
  RILLMARK_HOST: z.string().default('127.0.0.1'),
  RILLMARK_PUBLIC_URL: z.string().url().default('http://127.0.0.1:4280'),
  RILLMARK_SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').default(DEV_SESSION_SECRET),
  RILLMARK_SESSION_HOURS: z.coerce.number().positive().default(12),
  RILLMARK_SECURE_COOKIES: bool.default(false),
  // Off by default: X-Forwarded-For is then ignored. Behind a proxy, name it (address, subnet, `loopback`) or give
  // the number of proxy hops. `true` (trust every hop) would let any client choose its own address: refused.
  RILLMARK_TRUST_PROXY: z
    .string()
    .default('false')
    .refine((v) => v.trim() !== 'true', 'must name the proxy (address, subnet or loopback) or a hop count, not true'),
  RILLMARK_SIGNIN_MAX_ATTEMPTS: z.coerce.number().int().min(1).default(8),
  RILLMARK_SIGNIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  RILLMARK_SIGNIN_MAX_DELAY_SECONDS: z.coerce.number().int().min(1).max(3_600).default(60),
  RILLMARK_SMTP_HOST: z.string().default('127.0.0.1'),
  RILLMARK_SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2526),
  // none: plain SMTP (the local fake, or a relay on loopback); starttls: upgrade required;
  // implicit: TLS from the start (port 465).
  RILLMARK_SMTP_TLS: z.enum(['none', 'starttls', 'implicit']).default('none'),
  RILLMARK_SMTP_USER: z.string().optional(),
  RILLMARK_SMTP_PASSWORD: z.string().optional(),
  // Retry back-off of undelivered mail: 1, 2, 5, 10, 30, 60, 120, 240 times this; and how often due mail is looked for.
  RILLMARK_MAIL_RETRY_SECONDS: z.coerce.number().int().min(1).max(3_600).default(60),
  RILLMARK_MAIL_POLL_SECONDS: z.coerce.number().int().min(1).max(60).default(60),
  RILLMARK_MAIL_FROM: z.string().default('Rillmark <no-reply@rillmark.invalid>'),
  RILLMARK_FAKE_SMTP_HTTP_PORT: z.coerce.number().int().min(1).max(65535).default(2580),
  // Development only: off unless switched on, and refused with NODE_ENV=production.
  RILLMARK_DEV_OUTBOX: bool.default(false),
  RILLMARK_WEB_DIR: z.string().default('dist/web/browser'),
  RILLMARK_INVITE_HOURS: z.coerce.number().positive().default(72),
  RILLMARK_WEATHER_FEED_URL: z.string().url().default('http://127.0.0.1:2590'),
  RILLMARK_WEATHER_FEED_TIMEOUT_MS: z.coerce.number().int().min(100).max(120_000).default(10_000),
  RILLMARK_JOBS_ENABLED: bool.default(true),
  RILLMARK_UPLOAD_MAX_MB: z.coerce.number().positive().max(10_000).default(200),
  RILLMARK_UPLOAD_DIR: z.string().default('.data/uploads'),
  // The watch ticks hourly and checks each site once its local clock passes RILLMARK_WATCH_LOCAL_HOUR.
  RILLMARK_WATCH_CRON: z
    .string()
    .regex(/^\S+( \S+){4}$/, 'must be a five-field cron expression')
    .default('15 * * * *'),
  RILLMARK_WATCH_LOCAL_HOUR: z.coerce.number().int().min(0).max(23).default(4),
  RILLMARK_LOG_LEVEL: z.enum(['debug', 'info', 'warn', 'error', 'silent']).default('info'),
});

export type Env = z.infer<typeof schema>;

export interface Config {
  env: Env['NODE_ENV'];
  db: {
    host: string;
    port: number;
    database: string;
    user: string;
    password: string;
    poolSize: number;
    queryTimeoutMs: number;
  };
  http: { host: string; port: number; publicUrl: string; trustProxy: false | number | string; webDir: string };
  session: { secret: string; maxAgeMs: number; secureCookies: boolean };
  signIn: { maxAttempts: number; windowMs: number; maxDelayMs: number };
  mail: {
    host: string;
    port: number;
    from: string;
    tls: 'none' | 'starttls' | 'implicit';
    auth: { user: string; password: string } | null;
    fakeServerHttpPort: number;
    devOutbox: boolean;
    retryBaseMs: number;
    pollSeconds: number;
  };
  inviteTtlMs: number;
  weather: { feedUrl: string; feedTimeoutMs: number };
  /** Scheduled jobs (mail delivery, nightly checks) run in this instance; tests switch them off. */
  jobs: { enabled: boolean };
  /** Uploads: the size limit and where original files are kept. */
  uploads: { maxBytes: number; dir: string };
  /** The nightly watch: the scheduler's tick and the local hour after which a site's night is checked. */
  watch: { cron: string; localHour: number };
  logLevel: Env['RILLMARK_LOG_LEVEL'];
}

export function loadConfig(source: Record<string, string | undefined> = process.env): Config {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const unsafe = unsafeSettings(e);
  if (unsafe.length) throw new Error(`Unsafe configuration:\n${unsafe.map((l) => `  ${l}`).join('\n')}`);
  return {
    env: e.NODE_ENV,
    db: {
      host: e.RILLMARK_DB_HOST,
      port: e.RILLMARK_DB_PORT,
      database: e.RILLMARK_DB_NAME,
      user: e.RILLMARK_DB_USER,
      password: e.RILLMARK_DB_PASSWORD,
      poolSize: e.RILLMARK_DB_POOL_SIZE,
      queryTimeoutMs: e.RILLMARK_DB_QUERY_TIMEOUT_MS,
    },
    http: {
      host: e.RILLMARK_HOST,
      port: e.RILLMARK_PORT,
      publicUrl: e.RILLMARK_PUBLIC_URL.replace(/\/$/, ''),
      trustProxy: trustProxy(e.RILLMARK_TRUST_PROXY),
      webDir: e.RILLMARK_WEB_DIR,
    },
    session: {
      secret: e.RILLMARK_SESSION_SECRET,
      maxAgeMs: e.RILLMARK_SESSION_HOURS * 3_600_000,
      secureCookies: e.RILLMARK_SECURE_COOKIES,
    },
    signIn: {
      maxAttempts: e.RILLMARK_SIGNIN_MAX_ATTEMPTS,
      windowMs: e.RILLMARK_SIGNIN_WINDOW_MINUTES * 60_000,
      maxDelayMs: e.RILLMARK_SIGNIN_MAX_DELAY_SECONDS * 1000,
    },
    mail: {
      host: e.RILLMARK_SMTP_HOST,
      port: e.RILLMARK_SMTP_PORT,
      from: e.RILLMARK_MAIL_FROM,
      tls: e.RILLMARK_SMTP_TLS,
      auth: e.RILLMARK_SMTP_USER ? { user: e.RILLMARK_SMTP_USER, password: e.RILLMARK_SMTP_PASSWORD ?? '' } : null,
      fakeServerHttpPort: e.RILLMARK_FAKE_SMTP_HTTP_PORT,
      devOutbox: e.RILLMARK_DEV_OUTBOX,
      retryBaseMs: e.RILLMARK_MAIL_RETRY_SECONDS * 1000,
      pollSeconds: e.RILLMARK_MAIL_POLL_SECONDS,
    },
    inviteTtlMs: e.RILLMARK_INVITE_HOURS * 3_600_000,
    weather: {
      feedUrl: e.RILLMARK_WEATHER_FEED_URL.replace(/\/$/, ''),
      feedTimeoutMs: e.RILLMARK_WEATHER_FEED_TIMEOUT_MS,
    },
    jobs: { enabled: e.RILLMARK_JOBS_ENABLED },
    uploads: { maxBytes: Math.round(e.RILLMARK_UPLOAD_MAX_MB * 1024 * 1024), dir: e.RILLMARK_UPLOAD_DIR },
    watch: { cron: e.RILLMARK_WATCH_CRON, localHour: e.RILLMARK_WATCH_LOCAL_HOUR },
    logLevel: e.RILLMARK_LOG_LEVEL,
  };
}

const isLoopback = (host: string) => host === 'localhost' || host === '::1' || /^127\./.test(host);

/** Settings that are fine on a laptop and dangerous on a server: refused (with NODE_ENV=production where noted). */
function unsafeSettings(e: Env): string[] {
  const problems: string[] = [];
  if (Boolean(e.RILLMARK_SMTP_USER) !== Boolean(e.RILLMARK_SMTP_PASSWORD))
    problems.push('RILLMARK_SMTP_USER and RILLMARK_SMTP_PASSWORD: set both or neither');
  if (e.NODE_ENV !== 'production') return problems;
  if (e.RILLMARK_SESSION_SECRET === DEV_SESSION_SECRET || /change-me/i.test(e.RILLMARK_SESSION_SECRET))
    problems.push(
      'RILLMARK_SESSION_SECRET: still the development value; set a long random one (openssl rand -base64 48)',
    );
  if (e.RILLMARK_DEV_OUTBOX)
    problems.push('RILLMARK_DEV_OUTBOX: the development outbox is refused with NODE_ENV=production; set it to false');
  if (e.RILLMARK_SMTP_TLS === 'none' && !isLoopback(e.RILLMARK_SMTP_HOST))
    problems.push(
      `RILLMARK_SMTP_TLS: mail to ${e.RILLMARK_SMTP_HOST} would go unencrypted; set starttls or implicit ` +
        '(plain SMTP only to a relay on loopback)',
    );
  if (e.RILLMARK_SMTP_USER && e.RILLMARK_SMTP_TLS === 'none' && !isLoopback(e.RILLMARK_SMTP_HOST))
    problems.push('RILLMARK_SMTP_PASSWORD: would be sent in clear; set RILLMARK_SMTP_TLS to starttls or implicit');
  return problems;
}

/** Express's `trust proxy`: off, a hop count, or the proxies' addresses/subnets (comma-separated). */
function trustProxy(value: string): false | number | string {
  const v = value.trim();
  if (v === '' || v === 'false' || v === '0') return false;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}
