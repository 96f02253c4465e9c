import express, { type Express, type RequestHandler } from 'express';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import type { Database } from './db/client';
import { errorHandler, NotFoundError } from './errors';
import { healthRoutes } from './routes/health.routes';
import { authRoutes } from './routes/auth.routes';
import { absoluteTimeout, sessionMiddleware } from './auth/session';
import { createPassport } from './auth/passport';
import { doubleCsrfProtection } from './auth/csrf';
import { mailer as defaultMailer, type Mailer } from './mail/transport';
import { invitationRoutes } from './routes/invitations.routes';
import { userRoutes } from './routes/users.routes';
import { adminRoutes } from './routes/admin.routes';
import { devRoutes } from './routes/dev.routes';
import { followUpRoutes } from './routes/follow-ups.routes';
import { selfReportRoutes } from './routes/self-report.routes';
import { analyticsRoutes } from './routes/analytics.routes';
import { cohortRoutes } from './routes/cohorts.routes';
import { dataRequestRoutes } from './routes/data-requests.routes';
import { episodeRoutes } from './routes/episodes.routes';
import { referenceRoutes } from './routes/reference.routes';
import { uploadRoutes } from './routes/uploads.routes';
import { env } from './env';

export type AppDeps = Database & {
  /** Serves the client (built files or Vite middleware); absent in API-only tests. */
  client?: RequestHandler[];
  log?: (message: string) => void;
  /** Outgoing mail; tests inject the fake SMTP server's mailer. Default: SMTP from the environment. */
  mailer?: Mailer;
};

/** Builds the Express app: middleware, routes and the error handler. Never listens. */
export function createApp(deps: AppDeps): Express {
  const log = deps.log ?? ((m: string) => console.error(m));
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Vega renders SVG with inline style attributes; no inline scripts, no third-party origins.
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'connect-src': ["'self'"],
          'font-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const pp = createPassport(deps.db);
  const mailer = deps.mailer ?? defaultMailer();
  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRoutes(deps.db));
  api.use(cookieParser());
  api.use(sessionMiddleware(deps.pool));
  api.use(absoluteTimeout());
  api.use(pp.initialize());
  api.use(pp.session());
  api.use(doubleCsrfProtection);
  api.use(authRoutes({ db: deps.db, pp, mailer, log }));
  api.use(invitationRoutes({ db: deps.db, mailer, log }));
  api.use(userRoutes(deps.db));
  api.use(adminRoutes(deps.db));
  api.use(followUpRoutes(deps.db));
  api.use(selfReportRoutes(deps.db));
  api.use(analyticsRoutes(deps.db));
  api.use(cohortRoutes(deps.db));
  api.use(dataRequestRoutes({ db: deps.db, mailer, log }));
  api.use(episodeRoutes(deps.db));
  api.use(referenceRoutes(deps.db));
  api.use(uploadRoutes(deps.db));
  if (env().NODE_ENV !== 'production') api.use(devRoutes());
  api.use(() => {
    throw new NotFoundError('No such API route');
  });
  app.use('/api', api);

  for (const handler of deps.client ?? []) app.use(handler);
  app.use(errorHandler(log));
  return app;
}
