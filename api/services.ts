import type { Config } from './config';
import { KeyStore } from './auth/key-store';
import type { SessionPrincipalResolver } from './auth/authenticate';
import { openDatabase, type Database } from './db/database';
import { createLogger, type Logger } from './logger';
import { createMailer, type Mailer } from './mail';
import { createConsoleSessions, type ConsoleSessions } from './session';
import { createUsageMeter, type UsageMeter } from './usage/usage-meter';
import { HeavyWork } from './work/heavy-work';
import { createSharedState, type SharedState } from './shared-state/shared-state';

/** What the routers need, built once per process (or per test). */
export interface Services {
  config: Config;
  db: Database;
  logger: Logger;
  keys: KeyStore;
  /** Resolves a console session to a principal; the session module replaces the default. */
  sessionPrincipal: SessionPrincipalResolver;
  /** Outgoing mail (invitations, key notices); in development and tests also the outbox. */
  mail: Mailer;
  /** Console sign-in: express-session on SQLite and passport-local. */
  sessions: ConsoleSessions;
  /** Counts `/v1` calls in memory and writes them in batches; flushed on close. */
  usage: UsageMeter;
  /** Worker threads for heavy calculations (`work.run(task, input)`); stopped on close. */
  work: HeavyWork;
  /** What instances share: in this process's memory, or in Redis when `REDIS_URL` is set. */
  shared: SharedState;
  /** Work to run on shutdown, in order, before the database closes (flushing metered usage...). */
  onClose: Array<() => Promise<void>>;
}

export async function createServices(config: Config): Promise<Services> {
  const logger = createLogger(config.logLevel);
  const db = await openDatabase(config.databaseUrl, {
    busyTimeoutMs: config.databaseBusyTimeoutMs,
    onBusyRetry: (attempt, err) =>
      logger.warn(
        { attempt, err: (err as Error).message },
        'database busy (another process writing); retrying',
      ),
    poolMax: config.databasePoolMax,
  });
  let shared: SharedState;
  try {
    shared = await createSharedState({ redisUrl: config.redisUrl, prefix: config.redisKeyPrefix, logger });
  } catch (err) {
    await db.close();
    throw err;
  }
  const mail = await createMailer(config, logger);
  logger.info(`mail goes to ${mail.description}`);
  const sessions = createConsoleSessions({ config, db, shared });
  const usage = createUsageMeter(db, config, logger, shared);
  const work = new HeavyWork({
    threads: config.workThreads,
    queueLimit: config.workQueueLimit,
    nice: config.workNice,
    heapLimitMb: config.workHeapLimitMb,
    onFault: (error) => logger.error({ err: error }, 'a heavy-work thread failed with no task on it'),
  });
  const keys = new KeyStore(db.models, config.keyHashSecret);
  // A revocation or role change anywhere (any instance, the command line) empties every instance's cache.
  keys.broadcast = () => shared.publishKeyChange();
  shared.onKeyChange(() => keys.dropCache());
  return {
    config,
    db,
    logger,
    shared,
    keys,
    sessionPrincipal: sessions.principal,
    mail,
    sessions,
    usage,
    work,
    onClose: [async () => sessions.close(), () => mail.close(), () => usage.close(), () => work.close()],
  };
}

export async function closeServices(services: Services): Promise<void> {
  for (const task of services.onClose) await task();
  await services.shared.close();
  await services.db.close();
}
