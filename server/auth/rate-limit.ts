import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import { env } from '../env';

/** The e-mail the request is about (sign-in, forgot), normalised like the schemas do; '' when absent. */
const accountOf = (req: Request) => {
  const e = (req.body as { email?: unknown } | undefined)?.email;
  return typeof e === 'string' ? e.trim().toLowerCase() : '';
};

export type AuthLimiters = { login: RequestHandler[]; forgot: RequestHandler[]; reset: RequestHandler[] };

/**
 * Rate limits of sign-in and password reset, per account AND per address (a memory store per
 * createApp, so tests never share counters). Successful sign-ins do not count: the limit is
 * aimed at guessing, not at a busy shared computer.
 */
export function createAuthLimiters(): AuthLimiters {
  const { AUTH_RATE_LIMIT: limit, AUTH_RATE_WINDOW_MINUTES: minutes } = env();
  const message = `Too many attempts. Wait ${minutes} minutes and try again.`;
  const make = (by: 'address' | 'account', skipSuccessfulRequests: boolean) =>
    rateLimit({
      windowMs: minutes * 60_000,
      limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      skipSuccessfulRequests,
      keyGenerator: (req) => (by === 'address' ? ipKeyGenerator(req.ip ?? '') : accountOf(req)),
      skip: (req) => by === 'account' && accountOf(req) === '',
      handler: (_req, res) => {
        res.status(429).json({ error: { message } });
      },
    });
  return {
    login: [make('address', true), make('account', true)],
    forgot: [make('address', false), make('account', false)],
    reset: [make('address', false)],
  };
}
