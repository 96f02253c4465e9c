import { Router } from 'express';
import type passport from 'passport';
import { LoginInputSchema } from '../../shared/auth';
import { generateCsrfToken } from '../auth/csrf';
import { currentUser } from '../auth/require-role';
import { UnauthorizedError } from '../errors';
import type { SessionUser } from '../../shared/auth';

const INVALID = 'E-mail or password is not right';

export function authRoutes(pp: passport.PassportStatic): Router {
  const router = Router();

  router.get('/auth/csrf', (req, res) => {
    res.json({ token: generateCsrfToken(req, res, { overwrite: true }) });
  });

  router.post('/auth/login', async (req, res) => {
    req.body = LoginInputSchema.parse(req.body);
    const user = await new Promise<SessionUser | false>((resolve, reject) =>
      pp.authenticate('local', { session: false }, (err: unknown, u: SessionUser | false) =>
        err ? reject(err) : resolve(u),
      )(req, res, reject),
    );
    if (!user) throw new UnauthorizedError(INVALID);
    // passport regenerates the session id on logIn (no session fixation).
    await new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
    req.session.signedInAt = Date.now();
    res.json({ user });
  });

  router.post('/auth/logout', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('loadline.sid').status(204).end();
  });

  router.get('/auth/me', (req, res) => {
    res.json({ user: currentUser(req) });
  });

  return router;
}
