import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { SessionUser } from '../../shared/auth';
import type { Db } from '../db/client';
import { authenticate, findActiveUser } from './users.service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

/** A passport instance for one app: local strategy, the user id in the session, re-read every request. */
export function createPassport(db: Db): passport.PassportStatic {
  const p = new passport.Passport() as unknown as passport.PassportStatic;
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      authenticate(db, email, password).then((u) => done(null, u ?? false), done);
    }),
  );
  p.serializeUser((user, done) => done(null, user.id));
  // A deactivated or deleted user is signed out on their next request.
  p.deserializeUser((id: number, done) => {
    findActiveUser(db, id).then((u) => done(null, u ?? false), done);
  });
  return p;
}
