import type { Request } from 'express';
import type { SessionUser } from '../../shared/auth';
import type { Db } from '../db/client';
import { audit } from '../services/audit';

/** Starts a session for `user`; passport regenerates the session id first (no session fixation). */
export async function signIn(db: Db, req: Request, user: SessionUser): Promise<void> {
  await new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
  req.session.signedInAt = Date.now();
  await audit(db, { actorId: user.id, clinicId: user.clinicId, action: 'sign-in', entity: 'session' });
}

/** Ends the session in the store and in the request. */
export async function signOut(db: Db, req: Request): Promise<void> {
  const user = req.user;
  await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
  await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
  if (user) await audit(db, { actorId: user.id, clinicId: user.clinicId, action: 'sign-out', entity: 'session' });
}
