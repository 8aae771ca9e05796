import { z } from 'zod';

/**
 * Every setting the API reads, with its documented default. Parsed once at start-up;
 * a bad value stops the start with a message naming each bad variable.
 * `.env.example` at the project root lists the same variables.
 */
const port = z.coerce.number().int().min(1).max(65535);
const bool = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port.default(8080),
  PUBLIC_URL: z.url().optional(),
  DATA_DIR: z.string().default('.data'),
  WEB_DIST: z.string().optional(),

  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: port.default(3406),
  /**
   * Several database nodes (a Galera cluster), `host:port,host:port,…`: a new connection goes
   * to the first that accepts one, so the API keeps working when one node goes away.
   * Unset: DB_HOST and DB_PORT only.
   */
  DB_HOSTS: z
    .string()
    .regex(/^[^\s,:]+:\d{1,5}(,[^\s,:]+:\d{1,5})*$/, 'host:port,host:port,…')
    .optional(),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only')
    .default('shuntwise'),
  DB_USER: z.string().default('shuntwise'),
  DB_PASSWORD: z.string().min(1),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  DB_LOGGING: bool.default(false),

  JWT_SECRET: z.string().min(32, 'at least 32 characters'),
  JWT_TTL_SECONDS: z.coerce
    .number()
    .int()
    .min(60)
    .max(7 * 24 * 3600)
    .default(8 * 3600),
  JWT_ISSUER: z.string().default('shuntwise'),
  JWT_AUDIENCE: z.string().default('shuntwise-web'),

  /** Sign-in attempts per account (e-mail) per window; the per-address limit is LOGIN_RATE_LIMIT_PER_ADDRESS. */
  LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(20),
  /** Sign-in attempts per client address per window; unset = 5 × LOGIN_RATE_LIMIT (several people may share an address). */
  LOGIN_RATE_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).optional(),
  LOGIN_RATE_WINDOW_SECONDS: z.coerce.number().int().min(1).default(60),
  /** Uploads (datasheets, CSV imports and previews) per user per window. */
  UPLOAD_RATE_LIMIT: z.coerce.number().int().min(1).default(60),
  UPLOAD_RATE_WINDOW_SECONDS: z.coerce.number().int().min(1).default(600),
  /**
   * Which proxies' X-Forwarded-For to believe (Express "trust proxy"): false (default: the
   * socket address is the client), true, a hop count, or addresses/subnets such as
   * "loopback" or "10.0.0.0/8,127.0.0.1". Set it only when a proxy you run sits in front.
   */
  TRUST_PROXY: z
    .string()
    .default('false')
    .transform((v): boolean | number | string => (v === 'false' || v === '' || v === '0' ? false : v === 'true' ? true : /^\d+$/.test(v) ? Number(v) : v)),
  /** Send Strict-Transport-Security (only when the site is served over TLS; off by default for loopback). */
  HSTS: bool.default(false),
  HSTS_MAX_AGE_SECONDS: z.coerce
    .number()
    .int()
    .min(0)
    .default(180 * 24 * 3600),
  INVITATION_TTL_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 30)
    .default(72),

  S3_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().default('local'),
  S3_BUCKET: z
    .string()
    .regex(/^[a-z0-9][a-z0-9.-]{2,62}$/, 'an S3 bucket name')
    .default('shuntwise-datasheets'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_FAKE_PORT: port.default(4569),

  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: port.default(2525),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Shuntwise <shuntwise@demo.test>'),
  MAIL_RETRY_SECONDS: z.coerce.number().min(0.05).default(15),

  /** How long the readiness check reuses its last object-store and mail probe (they are probed in the background). */
  HEALTH_PROBE_SECONDS: z.coerce.number().min(0.05).max(300).default(5),
  /** Outbox claims: how long a replica holds the messages it took before another may take them (seconds). */
  MAIL_CLAIM_SECONDS: z.coerce.number().min(1).max(3600).default(120),

  UPLOAD_MAX_BYTES: z.coerce
    .number()
    .int()
    .min(1024)
    .default(20 * 1024 * 1024),
  // Datasheet reading runs in a child process, killed past these limits per file (api/src/extraction-worker).
  EXTRACTION_TIME_LIMIT_SECONDS: z.coerce.number().min(1).max(3600).default(20),
  EXTRACTION_MEMORY_LIMIT_MB: z.coerce.number().int().min(128).max(65536).default(1536),
  EXTRACTION_WORKERS: z.coerce.number().int().min(1).max(16).default(1),
  EXTRACTION_OCR: bool.default(true),
  EXTRACTION_OCR_MAX_PAGES: z.coerce.number().int().min(0).max(500).default(10),
  EXTRACTION_OCR_SECONDS_PER_PAGE: z.coerce.number().min(1).max(600).default(30),
  EXTRACTION_OCR_DPI: z.coerce.number().int().min(100).max(600).default(300),
  DEMO_PASSWORD: z.string().min(8).default('shuntwise-demo'),
});

export type Env = z.infer<typeof envSchema>;

export class EnvError extends Error {}

/** Parses the environment; throws one error listing every bad variable. */
export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = envSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new EnvError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return result.data;
}

/** The URL people open: PUBLIC_URL, else http://HOST:PORT. */
export function publicUrl(env: Env): string {
  return (env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/$/, '');
}

export const ENV = Symbol('ENV');
