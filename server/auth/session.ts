import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import { sql } from 'drizzle-orm';
import { env } from '../env';
import type { Tx } from '../services/audit';

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch), for the absolute time-out. */
    signedInAt?: number;
  }
}

const DEV_SECRET = 'loadline-development-session-secret-not-for-production';

export const SESSION_COOKIE = 'loadline.sid';

/** express-session stored in PostgreSQL (table `session`, created by a migration). Idle time-out rolls. */
export function sessionMiddleware(pool: pg.Pool): RequestHandler {
  const e = env();
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: e.SESSION_SECRET ?? DEV_SECRET,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 60 * 15 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: e.COOKIE_SECURE ?? e.NODE_ENV === 'production',
      maxAge: e.SESSION_IDLE_MINUTES * 60_000,
    },
  });
}

/**
 * Ends sessions older than the absolute time-out, whatever their activity: the stored session is
 * destroyed and replaced by an empty one, so the request continues signed out (401 where it matters).
 */
export function absoluteTimeout(now: () => number = Date.now): RequestHandler {
  const limit = env().SESSION_ABSOLUTE_HOURS * 3_600_000;
  return (req, _res, next) => {
    const at = req.session?.signedInAt;
    if (at && now() - at > limit) {
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}

/** Deletes every stored session of a user (password reset, deactivation): they are signed out everywhere. */
export async function endAllSessions(tx: Tx, userId: number): Promise<void> {
  await tx.execute(sql`delete from "session" where ("sess"->'passport'->>'user') = ${String(userId)}`);
}
