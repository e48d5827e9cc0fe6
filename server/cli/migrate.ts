/** `tsx server/cli/migrate.ts`: creates the database file or brings it up to date. */
import 'reflect-metadata';
import { ConfigError, loadConfig } from '../config';
import { openDatabase } from '../db/data-source';

try {
  const config = loadConfig();
  const { dataSource, applied } = await openDatabase(config);
  await dataSource.destroy();
  console.log(
    applied.length > 0
      ? `Database ${config.dbPath}: applied ${applied.join(', ')}`
      : `Database ${config.dbPath} is up to date.`,
  );
} catch (err) {
  console.error(err instanceof ConfigError ? `Cannot migrate. ${err.message}` : err);
  process.exit(err instanceof ConfigError ? 78 : 1);
}
