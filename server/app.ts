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

export type AppDeps = Database & {
  /** Serves the client (built files or Vite middleware); absent in API-only tests. */
  client?: RequestHandler[];
  log?: (message: string) => void;
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
  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRoutes(deps.db));
  api.use(cookieParser());
  api.use(sessionMiddleware(deps.pool));
  api.use(absoluteTimeout());
  api.use(pp.initialize());
  api.use(pp.session());
  api.use(doubleCsrfProtection);
  api.use(authRoutes(pp));
  api.use(() => {
    throw new NotFoundError('No such API route');
  });
  app.use('/api', api);

  for (const handler of deps.client ?? []) app.use(handler);
  app.use(errorHandler(log));
  return app;
}
