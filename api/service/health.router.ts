import { Router } from 'express';
import type { Database } from '../db/database';
import { storageFailureProblem } from '../db/storage-errors';

/**
 * Liveness answers without touching anything. Readiness proves that the database answers a read and
 * takes a write (a page-sized row written and removed, at most every two seconds): a full disk or a
 * read-only file makes it 503 with the same problem the failed requests get.
 */
export function healthRouter(db: Database): Router {
  const router = Router();
  router.get('/healthz', (_req, res) => {
    res.json({ status: 'ok' });
  });
  router.get('/readyz', async (_req, res) => {
    try {
      await db.sequelize.query('SELECT 1');
    } catch {
      // Through the one error path, like every other refusal.
      throw storageFailureProblem('unavailable');
    }
    const storage = await db.probeWrite();
    if (!storage.ok && storage.failure) throw storageFailureProblem(storage.failure);
    res.json({ status: 'ready' });
  });
  return router;
}
