import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { isPostgresUrl, sqliteStorage } from '../config';
import { defineModels, type Models } from './models';
import { isBusy, storageFailureOf, storageFailureProblem, type StorageFailure } from './storage-errors';
import { WriteQueue } from './write-queue';

export interface DatabaseOptions {
  /** How long a write waits for another process's write lock before SQLite answers busy. */
  busyTimeoutMs?: number;
  /** Attempts of one write transaction that found the database busy, before answering 503. */
  writeAttempts?: number;
  /** Told about each busy retry (for the log); the service passes its logger. */
  onBusyRetry?: (attempt: number, err: unknown) => void;
  /** Most connections held open to PostgreSQL (ignored on SQLite, which opens one per transaction). */
  poolMax?: number;
}

/** The engines Isochron runs on: the embedded default, or a PostgreSQL server shared by several instances. */
export type Dialect = 'sqlite' | 'postgres';

/** What readiness reports about the database file: whether a write went through. */
export interface StorageState {
  ok: boolean;
  failure: StorageFailure | null;
  /** The SQLite message of the last failed write, for the log. */
  message: string | null;
  checkedAt: Date | null;
}

export interface Database {
  dialect: Dialect;
  sequelize: Sequelize;
  models: Models;
  /**
   * Runs `work` in a write transaction. Use it for every write. SQLite: an IMMEDIATE transaction (the
   * write lock taken at BEGIN), after every write of this process queued before it (SQLite has one
   * writer). PostgreSQL: READ COMMITTED transactions side by side on the connection pool, with row locks
   * (`lock: transaction.LOCK.UPDATE`) where a write depends on what it read; other instances write
   * the same database at the same time, so an in-process queue would add waiting and no safety.
   * A transaction that lost a lock race (SQLite busy; PostgreSQL deadlock or serialization failure) is
   * retried a few times, then refused with 503.
   */
  write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  /** Statements run once on every new SQLite connection (Sequelize opens one per transaction); unused on PostgreSQL. */
  connectionPragmas: string[];
  /** The outcome of the latest write, as readiness reports it. */
  storage(): StorageState;
  /** Writes and removes a page-sized row, so readiness knows that writing really works; answers the state after it. */
  probeWrite(): Promise<StorageState>;
  /**
   * Runs `work` while no other instance runs work under this call on the same database (PostgreSQL: a
   * session advisory lock on a connection of its own). For start-up steps such as loading the demo
   * data into an empty database. SQLite: runs it at once.
   */
  exclusively<T>(work: () => Promise<T>): Promise<T>;
  /** Busy answers seen and retried since the database was opened. */
  readonly busyRetries: number;
  close(): Promise<void>;
}

export const DEFAULT_BUSY_TIMEOUT_MS = 2000;
const DEFAULT_WRITE_ATTEMPTS = 3;
const PROBE_INTERVAL_MS = 2000;

interface SqliteConnection {
  configure(option: 'busyTimeout', value: number): void;
  run(sql: string, callback: (err: Error | null) => void): void;
}

/**
 * Sequelize opens a new SQLite connection per transaction and has no hook for it (its `afterConnect`
 * hook is not called by the SQLite dialect), so the busy timeout and any pragma are set here, once per
 * connection, by wrapping the connection manager's `getConnection`.
 */
function prepareConnections(sequelize: Sequelize, busyTimeoutMs: number, pragmas: string[]): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: object): Promise<SqliteConnection>;
  };
  const getConnection = manager.getConnection.bind(manager);
  const prepared = new WeakSet<object>();
  manager.getConnection = async (options) => {
    const connection = await getConnection(options);
    if (!prepared.has(connection)) {
      prepared.add(connection);
      connection.configure('busyTimeout', busyTimeoutMs);
      for (const pragma of pragmas) {
        await new Promise<void>((resolve, reject) =>
          connection.run(pragma, (err) => (err ? reject(err) : resolve())),
        );
      }
    }
    return connection;
  };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * A page-sized row of random bytes: readiness writes and removes it to prove that writing works. Random,
 * so PostgreSQL cannot compress it away.
 */
const PROBE_INSERT: Record<Dialect, string> = {
  sqlite: 'INSERT INTO storage_probe (pad) VALUES (randomblob(8192))',
  postgres:
    "INSERT INTO storage_probe (pad) SELECT decode(string_agg(md5(random()::text), ''), 'hex') FROM generate_series(1, 512)",
};

function openSequelize(
  databaseUrl: string,
  options: DatabaseOptions,
): { sequelize: Sequelize; dialect: Dialect } {
  if (isPostgresUrl(databaseUrl)) {
    const sequelize = new Sequelize(databaseUrl, {
      dialect: 'postgres',
      logging: false,
      pool: { max: options.poolMax ?? 10, min: 0, idle: 10_000, acquire: 10_000 },
      // As on SQLite: a failed write is retried as a whole transaction, never statement by statement.
      retry: { max: 1 },
    });
    return { sequelize, dialect: 'postgres' };
  }
  const storage = sqliteStorage(databaseUrl);
  if (storage) mkdirSync(path.dirname(storage), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: storage ?? ':memory:',
    logging: false,
    // No statement-level retry: a busy write is retried as a whole transaction below.
    retry: { max: 1 },
  });
  return { sequelize, dialect: 'sqlite' };
}

export async function openDatabase(databaseUrl: string, options: DatabaseOptions = {}): Promise<Database> {
  const { sequelize, dialect } = openSequelize(databaseUrl, options);
  const pragmas: string[] = [];
  if (dialect === 'sqlite') {
    prepareConnections(sequelize, options.busyTimeoutMs ?? DEFAULT_BUSY_TIMEOUT_MS, pragmas);
    // WAL lets readers go on while the one writer commits; the mode persists in the file.
    if (sqliteStorage(databaseUrl)) await sequelize.query('PRAGMA journal_mode = WAL;');
    await migrate(sequelize);
  } else {
    try {
      await withAdvisoryLock(databaseUrl, MIGRATION_LOCK_ID, () => migrate(sequelize));
    } catch (err) {
      await sequelize.close();
      throw err;
    }
  }
  const models = defineModels(sequelize);
  // SQLite: one writer, so one queue. PostgreSQL: a queue that never waits, for draining on close.
  const queue = new WriteQueue();
  const inFlight = new Set<Promise<unknown>>();
  const enqueue = <T>(work: () => Promise<T>): Promise<T> => {
    if (dialect === 'sqlite') return queue.run(work);
    const running = work();
    inFlight.add(running);
    const forget = () => inFlight.delete(running);
    running.then(forget, forget);
    return running;
  };
  const attempts = options.writeAttempts ?? DEFAULT_WRITE_ATTEMPTS;
  let busyRetries = 0;
  let state: StorageState = { ok: true, failure: null, message: null, checkedAt: null };
  const note = (err: unknown) => {
    const failure = storageFailureOf(err);
    if (failure === null) {
      if (err === undefined) state = { ok: true, failure: null, message: null, checkedAt: new Date() };
      return;
    }
    if (failure !== 'busy') {
      state = { ok: false, failure, message: (err as Error).message ?? null, checkedAt: new Date() };
    }
  };

  /**
   * IMMEDIATE takes the write lock at BEGIN, so a transaction never reads a snapshot and then finds that
   * another process wrote meanwhile (which SQLite answers busy at once, whatever the timeout). Waiting
   * for the lock is SQLite's busy timeout; past it the whole transaction is tried again, then refused.
   */
  const transact = async <T>(work: (transaction: Transaction) => Promise<T>): Promise<T> => {
    for (let attempt = 1; ; attempt += 1) {
      try {
        const result = await sequelize.transaction(
          dialect === 'sqlite'
            ? { type: Transaction.TYPES.IMMEDIATE }
            : { isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED },
          work,
        );
        note(undefined);
        return result;
      } catch (err) {
        note(err);
        if (!isBusy(err)) throw err;
        if (attempt >= attempts) throw storageFailureProblem('busy');
        busyRetries += 1;
        options.onBusyRetry?.(attempt, err);
        await sleep(20 + Math.random() * 80 * attempt);
      }
    }
  };

  let probing: Promise<void> | null = null;
  let lastProbeAt = 0;
  const probeOnce = () =>
    enqueue(() =>
      transact(async (transaction) => {
        await sequelize.query(PROBE_INSERT[dialect], { transaction });
        await sequelize.query('DELETE FROM storage_probe', { transaction });
      }),
    );
  return {
    dialect,
    sequelize,
    models,
    write: (work) => enqueue(() => transact(work)),
    connectionPragmas: pragmas,
    storage: () => state,
    exclusively: (work) =>
      dialect === 'postgres' ? withAdvisoryLock(databaseUrl, START_UP_LOCK_ID, work) : work(),
    async probeWrite() {
      // While writes work, probe at most every PROBE_INTERVAL_MS; after a failure, on every call, one at a time.
      if (!probing && (!state.ok || Date.now() - lastProbeAt >= PROBE_INTERVAL_MS)) {
        lastProbeAt = Date.now();
        probing = probeOnce().then(
          () => {
            probing = null;
          },
          () => {
            probing = null;
          },
        );
      }
      if (probing) await probing;
      return state;
    },
    get busyRetries() {
      return busyRetries;
    },
    close: async () => {
      await queue.drain();
      await Promise.allSettled([...inFlight]);
      await sequelize.close();
    },
  };
}

/**
 * Several instances may start at once against one PostgreSQL database: a session-level advisory lock,
 * held on a connection of its own while `work` runs, lets exactly one of them migrate (or seed); the
 * others wait and then find nothing left to do.
 */
async function withAdvisoryLock<T>(databaseUrl: string, lockId: number, work: () => Promise<T>): Promise<T> {
  // Loaded here: the embedded default never needs the PostgreSQL driver.
  const { Client } = await import('pg');
  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [lockId]);
    return await work();
  } finally {
    await client.end();
  }
}

/** Any fixed numbers; only Isochron takes these advisory locks. */
const MIGRATION_LOCK_ID = 0x1c0c4;
const START_UP_LOCK_ID = 0x1c0c5;

export async function migrate(sequelize: Sequelize): Promise<void> {
  const umzug = new Umzug({
    migrations: {
      glob: ['migrations/*.{js,ts}', { cwd: __dirname, ignore: ['**/*.d.ts', '**/*.spec.*', '**/*.map'] }],
      resolve: ({ name, path: file, context }) => {
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        const migration = require(file as string);
        return {
          // The same migration is a .ts file in development and a .js file when built.
          name: name.replace(/\.(js|ts)$/, ''),
          up: () => migration.up({ context }),
          down: () => migration.down({ context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
  await umzug.up();
}
