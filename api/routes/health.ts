import { Router } from 'express';
import type { Database } from '../db/database';
import { storageFailureProblem } from '../db/storage-errors';
import { sendProblem } from '../http/problem';

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
  router.get('/readyz', async (req, res) => {
    try {
      await db.sequelize.query('SELECT 1');
    } catch {
      return sendProblem(res, storageFailureProblem('unavailable'), req.path);
    }
    const storage = await db.probeWrite();
    if (!storage.ok && storage.failure)
      return sendProblem(res, storageFailureProblem(storage.failure), req.path);
    res.json({ status: 'ready' });
  });
  return router;
}
