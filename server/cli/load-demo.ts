/**
 * `tsx server/cli/load-demo.ts`: creates or upgrades the database and loads the demo team
 * (Tern Field Flyers) once. Run by `npm run demo`; safe to run again.
 */
import 'reflect-metadata';
import { ConfigError, loadConfig } from '../config';
import { openDatabase } from '../db/data-source';
import { createMemoryMailer } from '../mail/mailer';
import { loadDemo } from '../demo/load-demo';
import { createServices } from '../services';
import { DEMO_PASSWORD, demoMembers } from '../../shared/sim/demo/crew';

async function main() {
  const config = loadConfig();
  const { dataSource } = await openDatabase(config);
  try {
    const started = Date.now();
    const result = await loadDemo(
      dataSource,
      createServices(dataSource, config, createMemoryMailer()),
    );
    if (!result.loaded) {
      console.log('Demo team already loaded; nothing to do.');
    } else {
      console.log(
        `Loaded the demo team: ${result.flights} flights, ${result.comments} comments in ${((Date.now() - started) / 1000).toFixed(1)} s.`,
      );
    }
    console.log(
      `Sign in as any of: ${demoMembers.map((m) => `${m.email} (${m.role})`).join(', ')}`,
    );
    console.log(`Demo password: ${DEMO_PASSWORD}`);
  } finally {
    await dataSource.destroy();
  }
}

main().catch((err: unknown) => {
  if (err instanceof ConfigError) {
    console.error(`Cannot load the demo. ${err.message}`);
    process.exit(78);
  }
  console.error(err instanceof Error ? (err.stack ?? err.message) : String(err));
  process.exit(1);
});
