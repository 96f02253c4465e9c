import { Router } from 'express';
import type { Db } from '../db/client';
import { adminClinicRoutes } from './admin-clinics.routes';
import { adminCodeRoutes } from './admin-codes.routes';
import { adminInstrumentRoutes } from './admin-instruments.routes';
import { adminPeopleRoutes } from './admin-people.routes';
import { auditRoutes } from './audit.routes';
import { rulesRoutes } from './rules.routes';

/** The steward's console: clinics, people, instruments, codes, rules and the audit trail. */
export function adminRoutes(db: Db): Router {
  const router = Router();
  router.use(adminClinicRoutes(db));
  router.use(adminPeopleRoutes(db));
  router.use(adminInstrumentRoutes(db));
  router.use(adminCodeRoutes(db));
  router.use(rulesRoutes(db));
  router.use(auditRoutes(db));
  return router;
}
