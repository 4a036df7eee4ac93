import { Router } from 'express';
import type { Database } from '../db/database';
import { ProblemError } from '../http/problem';

/** Liveness answers without touching anything; readiness proves the database answers. */
export function healthRouter(db: Database): Router {
  const router = Router();
  router.get('/healthz', (_req, res) => {
    res.json({ status: 'ok' });
  });
  router.get('/readyz', async (_req, res) => {
    try {
      await db.sequelize.query('SELECT 1');
    } catch {
      throw new ProblemError({ status: 503, title: 'Not ready', detail: 'The database does not answer.' });
    }
    res.json({ status: 'ready' });
  });
  return router;
}
