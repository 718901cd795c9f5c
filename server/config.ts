import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

export interface RateLimit {
  /** Requests counted per client address within the window (for sign-in: failed ones only). */
  limit: number;
  windowMs: number;
}

export interface ServerConfig {
  port: number;
  host: string;
  version: string;
  /** Folder with the built Angular app (index.html). */
  webRoot: string;
  jsonLimit: string;
  tokenSecret: string;
  logRequests: boolean;
  database: { host: string; port: number; user: string; password: string; dbName: string };
  /** Where people reach the app; links in mails start with it. */
  publicBaseUrl: string;
  /** An SMTP server to send through; when unset the server starts its own local stand-in and keeps the mail. */
  smtpUrl: string | null;
  mailFrom: string;
  /** Development routes (the mailbox) exist only outside production. */
  devRoutes: boolean;
  accessTokenSeconds: number;
  /**
   * How long this process may answer "the session is open" from memory (0: ask PostgreSQL on every request).
   * Ending a session in this process takes effect at once; other processes on the same database notice within this time.
   */
  sessionCacheSeconds: number;
  refreshTokenDays: number;
  /** bcrypt cost factor for new password hashes. */
  passwordHashCost: number;
  rateLimits: { signIn: RateLimit; reset: RateLimit };
  /** Self-service accounts through POST /api/auth/sign-up (otherwise only by invitation). */
  allowSignUp: boolean;
  seedDemo: boolean;
  demoPassword: string;
  /** Object storage for run field blobs and uploaded drawings (server/storage). */
  storage: {
    mode: 's3' | 'postgres';
    /** An S3 endpoint; when unset the server starts its own stand-in on loopback. */
    endpoint: string | null;
    bucket: string;
    region: string;
    accessKeyId: string;
    secretAccessKey: string;
    /** The local stand-in's objects. */
    dataDir: string;
  };
  /** Largest uploaded drawing (bytes). */
  uploadLimit: number;
  sweeps: SweepQueueConfig;
}

/** The sweep job queue (pg-boss in the project's database, schema `pgboss`); the server and the workers read the same. */
export interface SweepQueueConfig {
  /** A job still active this long after it started is taken to be lost (its worker died) and is retried. */
  jobExpirySeconds: number;
  /** Retries of a job that failed or expired, with exponential backoff from `retryDelaySeconds`. */
  retryLimit: number;
  retryDelaySeconds: number;
  /** How often pg-boss looks for expired jobs (one process does it per interval). */
  maintenanceSeconds: number;
  /** How often an idle worker asks for a job. */
  pollingSeconds: number;
  /** Solver threads per worker process (worker_threads), each taking one point at a time. */
  threads: number;
}

const root = join(__dirname, '..');

function packageVersion(): string {
  return (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
}

function numberFrom(value: string | undefined, fallback: number): number {
  const n = Number(value);
  return value !== undefined && value !== '' && Number.isFinite(n) ? n : fallback;
}

/** Reads the server's settings from the environment; a token secret is generated for local use when none is set. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const port = numberFrom(env['PORT'], 4300);
  const production = env['NODE_ENV'] === 'production';
  const window = numberFrom(env['RATE_LIMIT_WINDOW_MS'], 15 * 60_000);
  return {
    port,
    host: env['HOST'] ?? '127.0.0.1',
    version: packageVersion(),
    webRoot: env['WEB_ROOT'] ?? join(root, 'dist', 'web', 'browser'),
    jsonLimit: env['JSON_LIMIT'] ?? '16mb',
    tokenSecret: env['TOKEN_SECRET'] || randomBytes(32).toString('hex'),
    logRequests: env['LOG_REQUESTS'] !== '0',
    database: {
      host: env['PGHOST'] ?? '127.0.0.1',
      port: numberFrom(env['PGPORT'], 55432),
      user: env['PGUSER'] ?? 'postgres',
      password: env['PGPASSWORD'] ?? '',
      dbName: env['PGDATABASE'] ?? 'osmolane',
    },
    publicBaseUrl: (env['PUBLIC_URL'] || `http://127.0.0.1:${port}`).replace(/\/+$/, ''),
    smtpUrl: env['SMTP_URL'] || null,
    mailFrom: env['MAIL_FROM'] || 'Osmolane <no-reply@osmolane.invalid>',
    devRoutes: !production,
    accessTokenSeconds: numberFrom(env['ACCESS_TOKEN_SECONDS'], 15 * 60),
    sessionCacheSeconds: numberFrom(env['SESSION_CACHE_SECONDS'], 5),
    refreshTokenDays: numberFrom(env['REFRESH_TOKEN_DAYS'], 14),
    passwordHashCost: numberFrom(env['BCRYPT_COST'], 11),
    rateLimits: {
      signIn: { limit: numberFrom(env['SIGN_IN_LIMIT'], 10), windowMs: window },
      reset: { limit: numberFrom(env['RESET_LIMIT'], 10), windowMs: window },
    },
    allowSignUp: env['ALLOW_SIGN_UP'] !== '0',
    seedDemo: env['SEED_DEMO'] === '1',
    demoPassword: env['DEMO_PASSWORD'] || 'osmolane-demo',
    storage: {
      mode: env['STORAGE'] === 'postgres' ? 'postgres' : 's3',
      endpoint: env['S3_ENDPOINT'] || null,
      bucket: env['S3_BUCKET'] || 'osmolane',
      region: env['S3_REGION'] || 'us-east-1',
      accessKeyId: env['S3_ACCESS_KEY_ID'] || 'local',
      secretAccessKey: env['S3_SECRET_ACCESS_KEY'] || 'local',
      dataDir: env['S3_DATA_DIR'] || join(root, '.data', 's3'),
    },
    uploadLimit: numberFrom(env['UPLOAD_LIMIT'], 5 * 1024 * 1024),
    sweeps: {
      jobExpirySeconds: numberFrom(env['SWEEP_JOB_EXPIRY_SECONDS'], 600),
      retryLimit: numberFrom(env['SWEEP_RETRY_LIMIT'], 3),
      retryDelaySeconds: numberFrom(env['SWEEP_RETRY_DELAY_SECONDS'], 5),
      maintenanceSeconds: numberFrom(env['SWEEP_MAINTENANCE_SECONDS'], 30),
      pollingSeconds: numberFrom(env['SWEEP_POLLING_SECONDS'], 1),
      threads: numberFrom(env['SWEEP_WORKER_THREADS'], 1),
    },
  };
}
