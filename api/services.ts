import type { Config } from './config';
import { KeyStore } from './auth/key-store';
import type { SessionPrincipalResolver } from './auth/authenticate';
import { openDatabase, type Database } from './db/database';
import { createLogger, type Logger } from './logger';

/** What the routers need, built once per process (or per test). */
export interface Services {
  config: Config;
  db: Database;
  logger: Logger;
  keys: KeyStore;
  /** Resolves a console session to a principal; the session module replaces the default. */
  sessionPrincipal: SessionPrincipalResolver;
  /** Work to run on shutdown, in order, before the database closes (flushing metered usage...). */
  onClose: Array<() => Promise<void>>;
}

export async function createServices(config: Config): Promise<Services> {
  const db = await openDatabase(config.databaseUrl);
  return {
    config,
    db,
    logger: createLogger(config.logLevel),
    keys: new KeyStore(db.models, config.keyHashSecret),
    sessionPrincipal: async () => null,
    onClose: [],
  };
}

export async function closeServices(services: Services): Promise<void> {
  for (const task of services.onClose) await task();
  await services.db.close();
}
