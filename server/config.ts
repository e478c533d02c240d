// Runtime settings, read once from the environment. Scripts (npm start, npm test)
// set these; nothing else in the server reads process.env.

export interface Config {
  databaseUrl: string;
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
  loginLimits: { perAccount: number; perIp: number; windowMs: number };
  /** COLLAB_MAX_FRAME_BYTES: the largest collaboration frame (a Yjs update) a client may send; 1 MiB. */
  collabMaxFrameBytes: number;
  logLevel: string;
}

export function configFromEnv(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env.PORT ?? 4820);
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start and npm test set it for you).');
  const sessionSecret = env.SESSION_SECRET;
  if (!sessionSecret || sessionSecret.length < 32) throw new Error('SESSION_SECRET must be at least 32 characters.');
  return {
    databaseUrl,
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
      perAccount: Number(env.LOGIN_LIMIT_ACCOUNT ?? 10),
      perIp: Number(env.LOGIN_LIMIT_IP ?? 100),
      windowMs: 15 * 60_000,
    },
    collabMaxFrameBytes: Math.max(64 * 1024, Number(env.COLLAB_MAX_FRAME_BYTES ?? 1024 * 1024) || 1024 * 1024),
    logLevel: env.LOG_LEVEL ?? 'info',
  };
}
