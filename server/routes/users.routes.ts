import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../db/client';
import { currentUser, requireRole, scopeFromRequest } from '../auth/require-role';
import { deactivateAccount, listAccounts } from '../services/users.service';

const IdParam = z.object({ id: z.coerce.number().int().positive() });

export function userRoutes(db: Db): Router {
  const router = Router();

  router.get('/users', requireRole('steward', 'lead'), async (req, res) => {
    res.json({ accounts: await listAccounts(db, scopeFromRequest(req)) });
  });

  router.post('/users/:id/deactivate', requireRole('steward', 'lead'), async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json({ account: await deactivateAccount(db, currentUser(req), id) });
  });

  return router;
}
