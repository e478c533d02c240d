import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Config } from '../config';
import { AppError } from '../http/errors';

// Sign-in attempts are limited per IP address and per account (e-mail), so a
// password cannot be guessed from many addresses nor many accounts from one.
// The counters are in memory: enough for one app server; see docs/architecture.md.

function limiter(limit: number, windowMs: number, key: (req: Parameters<RequestHandler>[0]) => string, what: string): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: key,
    handler: (_req, _res, next, options) => {
      const retryAfter = Math.ceil(options.windowMs / 1000);
      next(new AppError(429, 'rate_limited', `Too many sign-in attempts ${what}. Try again later.`, { retryAfterSeconds: retryAfter }, { 'Retry-After': String(retryAfter) }));
    },
  });
}

export function createLoginLimiters(config: Config): RequestHandler[] {
  const { perAccount, perIp, windowMs } = config.loginLimits;
  const ipKey = (req: Parameters<RequestHandler>[0]) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`;
  const accountKey = (req: Parameters<RequestHandler>[0]) => {
    const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
    return `account:${email}`;
  };
  return [limiter(perIp, windowMs, ipKey, 'from this address'), limiter(perAccount, windowMs, accountKey, 'for this account')];
}
