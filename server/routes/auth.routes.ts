import { Router } from 'express';
import type passport from 'passport';
import { LoginInputSchema, type SessionUser } from '../../shared/auth';
import { ForgotInputSchema, ResetInputSchema } from '../../shared/account';
import type { Db } from '../db/client';
import { generateCsrfToken } from '../auth/csrf';
import { currentUser } from '../auth/require-role';
import { requestReset, resetPassword } from '../auth/password-reset';
import { createAuthLimiters } from '../auth/rate-limit';
import { SESSION_COOKIE } from '../auth/session';
import { signIn, signOut } from '../auth/sign-in';
import { UnauthorizedError } from '../errors';
import { env } from '../env';
import { accountLink } from '../mail/links';
import { sendOrLog } from '../mail/send';
import { resetMail } from '../mail/templates';
import type { Mailer } from '../mail/transport';

const INVALID = 'E-mail or password is not right';
const RESET_SENT = 'If an active account uses this e-mail, a link to choose a new password is on its way.';

export type AuthRouteDeps = { db: Db; pp: passport.PassportStatic; mailer: Mailer; log: (m: string) => void };

export function authRoutes({ db, pp, mailer, log }: AuthRouteDeps): Router {
  const router = Router();
  const limit = createAuthLimiters();

  router.get('/auth/csrf', (req, res) => {
    res.json({ token: generateCsrfToken(req, res, { overwrite: true }) });
  });

  router.post('/auth/login', ...limit.login, async (req, res) => {
    req.body = LoginInputSchema.parse(req.body);
    const user = await new Promise<SessionUser | false>((resolve, reject) =>
      pp.authenticate('local', { session: false }, (err: unknown, u: SessionUser | false) =>
        err ? reject(err) : resolve(u),
      )(req, res, reject),
    );
    if (!user) throw new UnauthorizedError(INVALID);
    await signIn(db, req, user);
    res.json({ user });
  });

  router.post('/auth/logout', async (req, res) => {
    await signOut(db, req);
    res.clearCookie(SESSION_COOKIE).status(204).end();
  });

  router.get('/auth/me', (req, res) => {
    const user = currentUser(req);
    res.json({ user, outbox: env().NODE_ENV !== 'production' && user.role === 'steward' });
  });

  // Always 202, answered before any lookup or e-mail, so neither the answer nor its timing tells
  // whether the account exists.
  router.post('/auth/forgot', ...limit.forgot, (req, res) => {
    const { email } = ForgotInputSchema.parse(req.body);
    res.status(202).json({ message: RESET_SENT });
    void requestReset(db, email)
      .then(
        (r) => r && sendOrLog(mailer, resetMail(r.to, accountLink('resetPassword', r.token)), 'password reset', log),
      )
      .catch((e: unknown) => log(`password reset request failed: ${e instanceof Error ? e.message : String(e)}`));
  });

  router.post('/auth/reset', ...limit.reset, async (req, res) => {
    await resetPassword(db, ResetInputSchema.parse(req.body));
    res.status(204).end();
  });

  return router;
}
