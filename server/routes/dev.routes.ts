import { Router } from 'express';
import { requireRole } from '../auth/require-role';
import { devOutbox } from '../mail/outbox';

/** Development helpers; server/app.ts mounts them only when NODE_ENV is not production. */
export function devRoutes(): Router {
  const router = Router();
  router.get('/dev/outbox', requireRole('steward'), (_req, res) => {
    res.json({ messages: devOutbox.list() });
  });
  return router;
}
