/**
 * `node --import tsx tests/services/with-services.ts CMD ARGS…`: starts throwaway PostgreSQL,
 * Redis and S3 (see local-services.ts), runs CMD with their variables set, stops them and
 * removes their folder whatever CMD did, and exits with CMD's status. `npm run test:postgres`
 * runs the server tests this way.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { servicesDown, servicesUp } from './local-services';

const [cmd, ...args] = process.argv.slice(2);
if (!cmd) {
  process.stderr.write('usage: with-services.ts CMD [ARGS…]\n');
  process.exit(64);
}
const dir = mkdtempSync(join(tmpdir(), 'hoverprint-services-'));
let status = 1;
try {
  const state = await servicesUp(dir);
  process.stderr.write(
    `PostgreSQL :${state.pgPort}, Redis :${state.redisPort}, S3 :${state.s3Port} up\n`,
  );
  const child = spawn(cmd, args, { stdio: 'inherit', env: { ...process.env, ...state.env } });
  const forward = (signal: NodeJS.Signals) => child.kill(signal);
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  status = await new Promise<number>((resolve) =>
    child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0))),
  );
} finally {
  await servicesDown(dir).catch((err: unknown) => {
    process.stderr.write(`Stopping the services failed: ${String(err)}\n`);
    status ||= 1;
  });
  rmSync(dir, { recursive: true, force: true });
}
process.exit(status);
