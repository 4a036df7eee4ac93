import { ProblemError } from '../http/problem';

/** Ways the database file can fail a request that are the server's state, not the request's fault. */
export type StorageFailure = 'busy' | 'full' | 'readOnly' | 'unavailable';

/** SQLite result codes (https://www.sqlite.org/rescode.html) as node-sqlite3 names them. */
const FAILURES: Record<string, StorageFailure> = {
  SQLITE_BUSY: 'busy',
  SQLITE_LOCKED: 'busy',
  SQLITE_FULL: 'full',
  SQLITE_READONLY: 'readOnly',
  SQLITE_PERM: 'readOnly',
  SQLITE_CANTOPEN: 'unavailable',
  SQLITE_IOERR: 'unavailable',
  SQLITE_CORRUPT: 'unavailable',
  SQLITE_NOTADB: 'unavailable',
  // PostgreSQL SQLSTATE codes (PostgreSQL 15 documentation, Appendix A): a lost lock race is retried
  // like SQLite's busy; the server or the network gone is unavailable.
  '40001': 'busy', // serialization_failure
  '40P01': 'busy', // deadlock_detected
  '55P03': 'busy', // lock_not_available
  '53100': 'full', // disk_full
  '25006': 'readOnly', // read_only_sql_transaction
  '57P01': 'unavailable', // admin_shutdown
  '57P02': 'unavailable', // crash_shutdown
  '57P03': 'unavailable', // cannot_connect_now
  '08000': 'unavailable', // connection_exception
  '08001': 'unavailable',
  '08003': 'unavailable',
  '08006': 'unavailable',
  '3D000': 'unavailable', // invalid_catalog_name: the database does not exist
  '28P01': 'unavailable', // invalid_password
  '28000': 'unavailable', // invalid_authorization_specification
  ECONNREFUSED: 'unavailable',
  ECONNRESET: 'unavailable',
  ETIMEDOUT: 'unavailable',
  ENOTFOUND: 'unavailable',
  // The same failures seen by Node's own file calls (creating the folder, the secrets file).
  ENOSPC: 'full',
  EROFS: 'readOnly',
  EACCES: 'readOnly',
  EPERM: 'readOnly',
};

/** Sequelize's own errors for a pool that cannot reach or hand out a PostgreSQL connection. */
const SEQUELIZE_FAILURES: Record<string, string> = {
  SequelizeConnectionRefusedError: 'ECONNREFUSED',
  SequelizeHostNotFoundError: 'ENOTFOUND',
  SequelizeConnectionTimedOutError: 'ETIMEDOUT',
  SequelizeConnectionAcquireTimeoutError: '55P03',
};

/** The SQLite, PostgreSQL or file-system code behind an error, however Sequelize wrapped it. */
export function storageCode(err: unknown): string | null {
  for (let e = err as Record<string, unknown> | null, depth = 0; e && depth < 4; depth += 1) {
    const code = e.code;
    if (typeof code === 'string' && code in FAILURES) return code;
    if (typeof e.name === 'string' && e.name in SEQUELIZE_FAILURES) return SEQUELIZE_FAILURES[e.name];
    if (typeof e.message === 'string') {
      const named = /\b(SQLITE_[A-Z]+)\b/.exec(e.message)?.[1];
      if (named && named in FAILURES) return named;
    }
    e = (e.parent ?? e.original ?? null) as Record<string, unknown> | null;
  }
  return null;
}

export function storageFailureOf(err: unknown): StorageFailure | null {
  const code = storageCode(err);
  return code ? FAILURES[code] : null;
}

export const isBusy = (err: unknown): boolean => storageFailureOf(err) === 'busy';

const DETAILS: Record<StorageFailure, { title: string; detail: string; retryAfterS: number }> = {
  busy: {
    title: 'Database busy',
    detail:
      'The database stayed busy with other writes; nothing was stored. Retry after the time given in Retry-After (seconds).',
    retryAfterS: 1,
  },
  full: {
    title: 'Storage full',
    detail: "The server's disk is full; nothing was stored. An operator must free space; retry later.",
    retryAfterS: 60,
  },
  readOnly: {
    title: 'Storage read-only',
    detail:
      'The database cannot be written on the server (a read-only file or disk); nothing was stored. An operator must fix it; retry later.',
    retryAfterS: 60,
  },
  unavailable: {
    title: 'Storage unavailable',
    detail:
      'The database cannot be read or written on the server; nothing was stored. An operator must fix it; retry later.',
    retryAfterS: 60,
  },
};

const TYPES: Record<StorageFailure, string> = {
  busy: 'database-busy',
  full: 'storage-full',
  readOnly: 'storage-read-only',
  unavailable: 'storage-unavailable',
};

/** The 503 problem for a storage failure. */
export function storageFailureProblem(failure: StorageFailure): ProblemError {
  const { title, detail, retryAfterS } = DETAILS[failure];
  return new ProblemError({
    status: 503,
    title,
    detail,
    type: TYPES[failure],
    headers: { 'Retry-After': String(retryAfterS) },
  });
}

/**
 * The problem document for an error the database raised, or null when it is not a storage error. A
 * foreign key that fails is a row removed by a racing request: a conflict, never a 500.
 */
export function storageProblem(err: unknown): ProblemError | null {
  const failure = storageFailureOf(err);
  if (failure) return storageFailureProblem(failure);
  // PostgreSQL runs writes side by side: a racing request may store the same unique value first.
  if ((err as { name?: string } | null)?.name === 'SequelizeUniqueConstraintError') {
    return new ProblemError({
      status: 409,
      title: 'Conflict',
      detail: 'Another request stored the same thing at the same moment; nothing was stored. Read it again.',
    });
  }
  if ((err as { name?: string } | null)?.name === 'SequelizeForeignKeyConstraintError') {
    return new ProblemError({
      status: 409,
      title: 'Conflict',
      detail: 'Something this request refers to was removed meanwhile; nothing was stored.',
    });
  }
  return null;
}

/** One line for an operator, naming the file and what to do, for a storage error at start-up. */
export function describeStorageFailure(err: unknown, file: string | null): string | null {
  const code = storageCode(err);
  if (!code) return null;
  const where = file ?? 'the database';
  if (!code.startsWith('SQLITE_') && file === null && !/^E[A-Z]+$/.test(code)) {
    return `Cannot use the PostgreSQL database (${code}): check DATABASE_URL, that the server runs and that the database and user exist.`;
  }
  if (file === null && /^E(CONNREFUSED|CONNRESET|TIMEDOUT|NOTFOUND)$/.test(code)) {
    return `Cannot reach the PostgreSQL server (${code}): check the host and port in DATABASE_URL and that the server runs.`;
  }
  switch (FAILURES[code]) {
    case 'readOnly':
      return `Cannot write ${where} (${code}): the file or its folder is read-only for this user. Make both writable (SQLite also writes -wal and -shm files beside it) or point DATABASE_URL at a writable file.`;
    case 'full':
      return `Cannot write ${where} (${code}): the disk is full. Free space and start again.`;
    case 'busy':
      return `Cannot open ${where} (${code}): another process holds it locked. Stop it or wait, then start again.`;
    default:
      return `Cannot open ${where} (${code}): it is missing, unreadable or not an SQLite database. Check DATABASE_URL.`;
  }
}
