/**
 * `npm run services -- up [--dir DIR]` starts throwaway PostgreSQL, Redis and S3 (s3rver) for
 * development and the PostgreSQL test leg, and prints the variables to export;
 * `npm run services -- down [--dir DIR]` stops them and removes the folder.
 * `eval "$(npm run -s services -- up)"` sets the variables in the current shell.
 */
import { mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { servicesDown, servicesUp } from './local-services';

const args = process.argv.slice(2);
const command = args[0];
const dirFlag = args.indexOf('--dir');
const dir = resolve(
  dirFlag >= 0 && args[dirFlag + 1]
    ? args[dirFlag + 1]!
    : join(tmpdir(), `hoverprint-services-${process.getuid?.() ?? 'user'}`),
);

if (command === 'up') {
  mkdirSync(dir, { recursive: true });
  const state = await servicesUp(dir);
  for (const [k, v] of Object.entries(state.env)) process.stdout.write(`export ${k}=${v}\n`);
  process.stderr.write(
    `PostgreSQL :${state.pgPort}, Redis :${state.redisPort}, S3 :${state.s3Port} in ${dir}\n` +
      `Stop them with: npm run services -- down${dirFlag >= 0 ? ` --dir ${dir}` : ''}\n`,
  );
} else if (command === 'down') {
  await servicesDown(dir);
  rmSync(dir, { recursive: true, force: true });
  process.stderr.write(`Stopped the services in ${dir}\n`);
} else {
  process.stderr.write('usage: npm run services -- up|down [--dir DIR]\n');
  process.exit(64);
}
