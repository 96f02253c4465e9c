import express, { type Express, type RequestHandler } from 'express';
import type { Database } from './db/client';
import { errorHandler, NotFoundError } from './errors';
import { healthRoutes } from './routes/health.routes';

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

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRoutes(deps.db));
  api.use(() => {
    throw new NotFoundError('No such API route');
  });
  app.use('/api', api);

  for (const handler of deps.client ?? []) app.use(handler);
  app.use(errorHandler(log));
  return app;
}
