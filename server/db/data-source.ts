import 'reflect-metadata';
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import type BetterSqlite3 from 'better-sqlite3';
import { DataSource } from 'typeorm';
import type { Config } from '../config';
import { entities } from './entities';
import { migrations } from './migrations';
import { postgresMigrations } from './postgres';

export interface DataSourceOptions {
  /** Log SQL to the console (debugging only). */
  logging?: boolean;
}

type EngineConfig = Pick<Config, 'dbPath' | 'databaseUrl'>;

/** Which engine a configuration uses: PostgreSQL when DATABASE_URL is set, else the file. */
export const engineOf = (config: EngineConfig) =>
  config.databaseUrl === undefined ? 'sqlite' : 'postgres';

/**
 * The one TypeORM data source: over better-sqlite3 by default, over `pg` when DATABASE_URL is set. Entities and migrations are listed
 * explicitly: globs do not survive tsx or bundling. The schema only changes through
 * migrations, in tests too, so the migrations are exercised on every run.
 */
export function createDataSource(config: EngineConfig, options: DataSourceOptions = {}) {
  if (config.databaseUrl !== undefined)
    return createPostgresDataSource(config.databaseUrl, options);
  if (config.dbPath !== ':memory:') mkdirSync(dirname(config.dbPath), { recursive: true });
  return new DataSource({
    type: 'better-sqlite3',
    database: config.dbPath,
    enableWAL: true,
    // Wait for a competing writer (a CLI, a second process) instead of failing at once.
    timeout: 5000,
    prepareDatabase: (db: BetterSqlite3.Database) => {
      db.pragma('busy_timeout = 5000');
      // In WAL mode NORMAL is still durable against a killed process; only an OS crash or
      // power loss can lose the last transactions (sqlite.org/wal.html).
      db.pragma('synchronous = NORMAL');
    },
    entities,
    migrations,
    migrationsRun: false,
    synchronize: false,
    logging: options.logging ?? false,
  });
}

function createPostgresDataSource(url: string, options: DataSourceOptions) {
  return new DataSource({
    type: 'postgres',
    url,
    applicationName: 'hoverprint',
    // Unix-ms times are bigint columns; they fit a double exactly, so read them as numbers.
    parseInt8: true,
    entities,
    migrations: postgresMigrations,
    migrationsRun: false,
    synchronize: false,
    logging: options.logging ?? false,
  });
}

/** Any fixed number shared by every server of one database; names our migration lock. */
const MIGRATION_LOCK = 0x4f7e_9c21;

/**
 * Runs the pending migrations holding a PostgreSQL advisory lock on a connection of its own, so
 * of several servers starting at once one migrates and the others wait, then find nothing to do.
 */
async function migrateUnderLock(dataSource: DataSource) {
  const lock = dataSource.createQueryRunner();
  await lock.connect();
  try {
    await lock.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK]);
    return await dataSource.runMigrations({ transaction: 'each' });
  } finally {
    await lock.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK]).catch(() => undefined);
    await lock.release();
  }
}

/** Opens the database and applies every pending migration; returns the names applied. */
export async function openDatabase(config: EngineConfig, options: DataSourceOptions = {}) {
  const dataSource = createDataSource(config, options);
  await dataSource.initialize();
  const applied =
    engineOf(config) === 'postgres'
      ? await migrateUnderLock(dataSource)
      : await dataSource.runMigrations({ transaction: 'each' });
  return { dataSource, applied: applied.map((m) => m.name) };
}
