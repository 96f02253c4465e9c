import { Router, type RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../db/client';
import { readSelfReportForm, submitSelfReport } from '../services/self-report.service';

/** Requests per address in each window: plenty for a waiting room on one network, little for guessing. */
export const SELF_REPORT_RATE_LIMIT = 60;
const WINDOW_MINUTES = 15;

/** A memory store per createApp, so apps (and test files) never share counters. */
function selfReportLimiter(): RequestHandler {
  return rateLimit({
    windowMs: WINDOW_MINUTES * 60_000,
    limit: SELF_REPORT_RATE_LIMIT,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, res) => {
      res
        .status(429)
        .json({
          error: { message: `Too many tries from this network. Wait ${WINDOW_MINUTES} minutes and try again.` },
        });
    },
  });
}

const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};

/**
 * The public pair a patient uses without signing in. The token in the address is the capability, so the POST is
 * exempt from CSRF (server/auth/csrf.ts) and nothing here reads the session.
 */
export function selfReportRoutes(db: Db): Router {
  const router = Router();
  const limit = selfReportLimiter();

  router.get('/self-report/:token', limit, noStore, async (req, res) => {
    res.json(await readSelfReportForm(db, String(req.params.token ?? '')));
  });

  router.post('/self-report/:token', limit, noStore, async (req, res) => {
    await submitSelfReport(db, String(req.params.token ?? ''), req.body);
    res.status(201).json({ received: true });
  });

  return router;
}
