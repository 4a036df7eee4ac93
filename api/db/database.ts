import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { Sequelize, type Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { sqliteStorage } from '../config';
import { defineModels, type Models } from './models';
import { WriteQueue } from './write-queue';

export interface Database {
  sequelize: Sequelize;
  models: Models;
  /** Runs `work` in a transaction, after every write queued before it. Use it for every write. */
  write<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  close(): Promise<void>;
}

export async function openDatabase(databaseUrl: string): Promise<Database> {
  const storage = sqliteStorage(databaseUrl);
  if (storage) mkdirSync(path.dirname(storage), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: storage ?? ':memory:',
    logging: false,
  });
  // WAL lets readers go on while the one writer commits; the mode persists in the file.
  if (storage) await sequelize.query('PRAGMA journal_mode = WAL;');
  await migrate(sequelize);
  const models = defineModels(sequelize);
  const queue = new WriteQueue();
  return {
    sequelize,
    models,
    write: (work) => queue.run(() => sequelize.transaction((transaction) => work(transaction))),
    close: async () => {
      await queue.drain();
      await sequelize.close();
    },
  };
}

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
