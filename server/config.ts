// Runtime settings, read once from the environment. Scripts (npm start, npm test)
// set these; nothing else in the server reads process.env.

export interface Config {
  /** DATABASE_URL: the MariaDB every instance shares (npm start starts a private one only when it is unset). */
  databaseUrl: string;
  /**
   * REDIS_URL: with it, several instances work as one (docs/scaling.md): draft updates, presence,
   * live events, access changes and cache invalidations cross through Redis pub/sub, sign-in limits
   * and evaluation leases live in Redis, heavy jobs go to BullMQ for `npm run worker`. Without it
   * (the default) everything stays in this process.
   */
  redisUrl: string | null;
  /** BEADLOOM_DATA_DIR: uploaded files; every instance and worker must see the same folder. */
  dataDir: string;
  port: number;
  /** Public origin used in e-mailed links, e.g. http://localhost:4820. */
  appUrl: string;
  sessionSecret: string;
  /** Real SMTP server; when absent the local sink is used and /dev/mail exists. */
  smtpUrl: string | null;
  mailFrom: string;
  production: boolean;
  /** BEADLOOM_DEV_MAIL=1: serve /dev/mail (admins only) even with NODE_ENV=production. */
  devMail: boolean;
  /** Where the built client lives; null serves no client (API-only tests). */
  clientDir: string | null;
  bcryptCost: number;
  /**
   * Failed sign-ins allowed before the back-off starts: per account + address (default 5), per
   * account from anywhere (50), per address over all accounts (100). See server/auth/rate-limit.ts.
   */
  loginLimits: { perAccount: number; perIp: number; windowMs: number; perAccountAddress?: number; baseBackoffMs?: number; maxBackoffMs?: number };
  /**
   * Express's `trust proxy`: false (the default) believes no X-Forwarded-* header. TRUST_PROXY=1 (or
   * true) trusts the one proxy in front; any other value is passed on (e.g. "loopback, 10.0.0.0/8").
   * Only then do sign-in limits key on X-Forwarded-For and the session cookie follow X-Forwarded-Proto.
   */
  trustProxy: boolean | number | string;
  /** Time budget of one chemistry job in a worker thread (CHEM_JOB_TIMEOUT_MS, default 10 s). */
  chemJobTimeoutMs: number;
  /** COLLAB_MAX_FRAME_BYTES: the largest collaboration frame (a Yjs update) a client may send; 1 MiB. */
  collabMaxFrameBytes: number;
  logLevel: string;
  /** REFERENCE_MAX_BYTES: the largest reference file (structure or trajectory) accepted; 2 GiB. */
  referenceMaxBytes: number;
  /** PROJECT_QUOTA_BYTES: all reference files of one project together; 20 GiB. */
  projectQuotaBytes: number;
}

export function configFromEnv(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env.PORT ?? 4820);
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start and npm test set it for you).');
  const sessionSecret = env.SESSION_SECRET;
  if (!sessionSecret || sessionSecret.length < 32) throw new Error('SESSION_SECRET must be at least 32 characters.');
  return {
    databaseUrl,
    redisUrl: env.REDIS_URL || null,
    dataDir: env.BEADLOOM_DATA_DIR || '.data/files',
    port,
    appUrl: (env.APP_URL ?? `http://localhost:${port}`).replace(/\/$/, ''),
    sessionSecret,
    smtpUrl: env.SMTP_URL || null,
    mailFrom: env.MAIL_FROM ?? 'Beadloom <no-reply@beadloom.localhost>',
    production: env.NODE_ENV === 'production',
    devMail: env.BEADLOOM_DEV_MAIL === '1',
    clientDir: env.CLIENT_DIR ?? 'dist',
    bcryptCost: Math.max(12, Number(env.BCRYPT_COST ?? 12)),
    loginLimits: {
      perAccountAddress: Number(env.LOGIN_LIMIT_ACCOUNT_ADDRESS ?? 5),
      perAccount: Number(env.LOGIN_LIMIT_ACCOUNT ?? 50),
      perIp: Number(env.LOGIN_LIMIT_IP ?? 100),
      windowMs: 15 * 60_000,
      baseBackoffMs: positive(env.LOGIN_BACKOFF_BASE_MS, 1000),
      maxBackoffMs: 15 * 60_000,
    },
    collabMaxFrameBytes: Math.max(64 * 1024, Number(env.COLLAB_MAX_FRAME_BYTES ?? 1024 * 1024) || 1024 * 1024),
    trustProxy: trustProxyFrom(env.TRUST_PROXY),
    chemJobTimeoutMs: positive(env.CHEM_JOB_TIMEOUT_MS, 10_000),
    logLevel: env.LOG_LEVEL ?? 'info',
    referenceMaxBytes: positive(env.REFERENCE_MAX_BYTES, 2 * 1024 ** 3),
    projectQuotaBytes: positive(env.PROJECT_QUOTA_BYTES, 20 * 1024 ** 3),
  };
}

function trustProxyFrom(raw: string | undefined): boolean | number | string {
  const v = (raw ?? '').trim();
  if (v === '' || v === '0' || v.toLowerCase() === 'false') return false;
  if (v === '1' || v.toLowerCase() === 'true') return 1;
  return /^\d+$/.test(v) ? Number(v) : v;
}

function positive(raw: string | undefined, fallback: number): number {
  const n = Number(raw);
  return raw !== undefined && Number.isFinite(n) && n > 0 ? n : fallback;
}
