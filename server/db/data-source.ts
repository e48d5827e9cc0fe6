import 'reflect-metadata';
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import type BetterSqlite3 from 'better-sqlite3';
import { DataSource } from 'typeorm';
import type { Config } from '../config';
import { entities } from './entities';
import { migrations } from './migrations';

export interface DataSourceOptions {
  /** Log SQL to the console (debugging only). */
  logging?: boolean;
}

/**
 * The one TypeORM data source over better-sqlite3. Entities and migrations are listed
 * explicitly: globs do not survive tsx or bundling. The schema only changes through
 * migrations, in tests too, so the migrations are exercised on every run.
 */
export function createDataSource(config: Pick<Config, 'dbPath'>, options: DataSourceOptions = {}) {
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

/** Opens the database and applies every pending migration; returns the names applied. */
export async function openDatabase(
  config: Pick<Config, 'dbPath'>,
  options: DataSourceOptions = {},
) {
  const dataSource = createDataSource(config, options);
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'each' });
  return { dataSource, applied: applied.map((m) => m.name) };
}
