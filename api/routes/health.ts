import { Router } from 'express';
import type { Database } from '../db/database';

/** Liveness answers without touching anything; readiness proves the database answers. */
export function healthRouter(db: Database): Router {
  const router = Router();
  router.get('/healthz', (_req, res) => {
    res.json({ status: 'ok' });
  });
  router.get('/readyz', async (_req, res) => {
    try {
      await db.sequelize.query('SELECT 1');
      res.json({ status: 'ready' });
    } catch {
      res.status(503).type('application/problem+json').json({
        type: 'https://isochron.dev/problems/unavailable',
        title: 'Not ready',
        status: 503,
        detail: 'The database does not answer.',
      });
    }
  });
  return router;
}
