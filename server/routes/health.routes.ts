import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { Db } from '../db/client';

export function healthRoutes(db: Db): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await db.execute(sql`select 1`);
    res.json({ ok: true, db: 'up' });
  });
  return router;
}
