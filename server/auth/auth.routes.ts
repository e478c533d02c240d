import type { Request, Response, NextFunction } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { createCsrf } from './csrf';
import type passport from 'passport';
import { typed, validate } from '../http/validate';
import { changePasswordBody, forgotBody, loginBody, resetBody, updateMeBody, type LoginResponse } from '../../src/shared/auth';
import { createLoginLimiter, createRedisLoginLimiter } from './rate-limit';
import { AppError } from '../http/errors';
import { requireUser } from './access';
import { buildMe } from './me.service';
import { renameAccount } from './accounts.service';
import { changePassword, requestPasswordReset, resetPassword } from './auth.service';

interface AuthDeps {
  csrf: ReturnType<typeof createCsrf>;
  passport: passport.PassportStatic;
}

export function authRoutes(r: RouteTable, ctx: AppContext, { csrf, passport }: AuthDeps): void {
  const limiter = ctx.redis ? createRedisLoginLimiter(ctx.config, ctx.redis.commands, (err) => ctx.log.warn({ err }, 'sign-in limits: redis failed')) : createLoginLimiter(ctx.config);
  r.get('/api/auth/csrf', (req, res) => {
    res.json({ token: csrf.issue(req, res) });
  });

  /** Starts a session for `user` and answers LoginResponse; passport regenerates the session id (no session fixation). */
  const signIn = (req: Request, res: Response, next: NextFunction, user: Express.User) =>
    req.logIn(user, async (loginErr) => {
      if (loginErr) return next(loginErr);
      try {
        const body: LoginResponse = { user: await buildMe(ctx.db, user), csrfToken: csrf.issue(req, res) };
        res.json(body);
      } catch (e) {
        next(e);
      }
    });

  // passport reads the (checked) body itself, so this one validates as a middleware.
  r.post('/api/auth/login', limiter.check, validate({ body: loginBody }), (req: Request, res: Response, next: NextFunction) => {
    passport.authenticate('local', async (err: unknown, user: Express.User | false) => {
      try {
        // Only a wrong password (or unknown e-mail) counts against the limits; see rate-limit.ts.
        if (err instanceof AppError && err.code === 'invalid_credentials') await limiter.failed(req);
        if (err || !user) return next(err);
        await limiter.succeeded(req);
        signIn(req, res, next, user);
      } catch (e) {
        next(e);
      }
    })(req, res, next);
  });

  r.post('/api/auth/logout', (req, res, next) => {
    // passport gives the session a new id on sign-out; the collab sockets know the one they opened with.
    const sessionId = req.sessionID;
    req.logOut((err) => {
      if (err) return next(err);
      req.session.destroy(() => {
        ctx.accessChanges.publish({ kind: 'signed_out', sessionId });
        res.status(204).end();
      });
    });
  });

  r.post('/api/auth/forgot', typed({ body: forgotBody }, ({ body }, _req, res) => {
    // Answer at once and send in the background: the timing says nothing about the address.
    requestPasswordReset(ctx, body.email).catch((err) => ctx.log.error({ err }, 'password reset mail failed'));
    res.status(202).json({ ok: true });
  }));

  // Whoever just chose a password from their e-mailed link is signed in with it (a new session, as
  // at sign-in): 200 with the same body as a sign-in. 204 when the account is disabled.
  r.post('/api/auth/reset', typed({ body: resetBody }, async ({ body }, req, res, next) => {
    const user = await resetPassword(ctx, body.token, body.password);
    if (!user) return void res.status(204).end();
    signIn(req, res, next, user);
  }));

  r.get('/api/me', async (req, res) => {
    res.json(await buildMe(ctx.db, requireUser(req)));
  });

  r.patch('/api/me', typed({ body: updateMeBody }, async ({ body }, req, res) => {
    const user = requireUser(req);
    await renameAccount(ctx, user.id, body.displayName);
    res.json(await buildMe(ctx.db, { ...user, displayName: body.displayName }));
  }));

  r.post('/api/me/password', typed({ body: changePasswordBody }, async ({ body }, req, res, next) => {
    const user = requireUser(req);
    const sessionVersion = await changePassword(ctx, user.id, body.currentPassword, body.newPassword);
    // Every other session of the account ends; this one signs in again with the new version.
    req.logIn({ ...user, sessionVersion }, (err) => {
      if (err) return next(err);
      res.json({ csrfToken: csrf.issue(req, res) });
    });
  }));
}
