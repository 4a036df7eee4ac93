import type { components } from '../../shared/contract/api-types';
import { Router } from 'express';
import { storageFailureProblem } from '../db/storage-errors';
import { ProblemError } from '../http/problem';
import type { Services } from '../services';

/**
 * One dependency as readiness reports it (the contract's `DependencyState`): what it is, `sqlite` or
 * `postgresql` for the database, `redis` for the shared store, and whether it answers.
 */
export type DependencyState = components['schemas']['DependencyState'];

/** The 503 for a shared store (Redis) that does not answer: the server's state, not the request's fault. */
export function sharedStateProblem(): ProblemError {
  return new ProblemError({
    status: 503,
    title: 'Shared store unavailable',
    detail:
      'The Redis server the instances share (rate limits, sessions, key changes) does not answer; nothing was done. Retry after the time given in Retry-After (seconds).',
    type: 'shared-state-unavailable',
    headers: { 'Retry-After': '5' },
  });
}

/**
 * Liveness answers without touching anything. Readiness checks each dependency and names it: the
 * database answers a read and takes a write (a page-sized row written and removed, at most every two
 * seconds), and Redis, when configured, answers a PING. Any one down makes it 503 with the problem the
 * failed requests get (a full disk, a read-only file, a database or Redis that does not answer), plus
 * the list of dependencies and their state.
 */
export function healthRouter(services: Pick<Services, 'db' | 'shared'>): Router {
  const { db, shared } = services;
  const router = Router();
  router.get('/healthz', (_req, res) => {
    res.json({ status: 'ok' });
  });
  router.get('/readyz', async (_req, res) => {
    const checkDatabase = async (): Promise<ProblemError | null> => {
      try {
        await db.sequelize.query('SELECT 1');
      } catch {
        return storageFailureProblem('unavailable');
      }
      const storage = await db.probeWrite();
      return !storage.ok && storage.failure ? storageFailureProblem(storage.failure) : null;
    };
    const checkRedis = async (): Promise<ProblemError | null> =>
      shared.ping().then(
        () => null,
        () => sharedStateProblem(),
      );
    const checks: Array<{
      name: DependencyState['name'];
      engine: DependencyState['engine'];
      check: Promise<ProblemError | null>;
    }> = [
      {
        name: 'database',
        engine: db.dialect === 'postgres' ? 'postgresql' : 'sqlite',
        check: checkDatabase(),
      },
    ];
    if (shared.kind === 'redis') checks.push({ name: 'redis', engine: 'redis', check: checkRedis() });
    const problems = await Promise.all(checks.map((c) => c.check));
    const dependencies: DependencyState[] = checks.map((c, i) => ({
      name: c.name,
      engine: c.engine,
      status: problems[i] ? 'down' : 'up',
    }));
    const first = problems.find((p) => p !== null);
    if (first) {
      // Through the one error path, like every other refusal, naming every dependency's state.
      throw new ProblemError({
        status: first.status,
        title: first.title,
        detail: first.detail,
        type: first.type,
        headers: first.headers,
        extensions: { dependencies },
      });
    }
    res.json({ status: 'ready', dependencies });
  });
  return router;
}
