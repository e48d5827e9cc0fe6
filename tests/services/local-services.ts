/**
 * Throwaway PostgreSQL, Redis and S3 (s3rver) instances in one folder on free loopback ports,
 * for the PostgreSQL leg of the tests, the cluster test and developers (`npm run services`).
 * PostgreSQL and Redis are Debian's packages (`.ci/run` installs them); s3rver is a dev
 * dependency run as its own Node process. Nothing here is for production.
 */
import { execFileSync, spawn } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { writeFileSync } from 'node:fs';
import { createConnection, createServer } from 'node:net';
import { join, resolve } from 'node:path';

export interface ServicesState {
  dir: string;
  pgBin: string;
  pgPort: number;
  redisPort: number;
  s3Port: number;
  s3Pid: number;
  /** The variables a server (or the PostgreSQL test leg) needs to use these instances. */
  env: Record<string, string>;
}

const STATE_FILE = 'services.json';
/** s3rver checks signatures against this fixed key pair. */
const S3RVER_KEY = 'S3RVER';
export const SERVICES_BUCKET = 'hoverprint-raw';

/** A port that was free a moment ago (the OS hands out a fresh ephemeral one each time). */
export function freePort(): Promise<number> {
  return new Promise((res, rej) => {
    const s = createServer();
    s.once('error', rej);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => res(port));
    });
  });
}

/** Whether something accepts connections on 127.0.0.1:port. */
export function portOpen(port: number): Promise<boolean> {
  return new Promise((res) => {
    const c = createConnection({ host: '127.0.0.1', port });
    c.once('connect', () => {
      c.destroy();
      res(true);
    });
    c.once('error', () => res(false));
  });
}

async function waitFor(what: string, check: () => Promise<boolean>, tries = 200) {
  for (let i = 0; i < tries; i++) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${what} did not come up`);
}

/** Debian puts the PostgreSQL programs in /usr/lib/postgresql/<major>/bin, off the PATH. */
function findPgBin(): string {
  const root = '/usr/lib/postgresql';
  const majors = existsSync(root)
    ? readdirSync(root)
        .filter((d) => existsSync(join(root, d, 'bin', 'initdb')))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  if (majors.length === 0)
    throw new Error('PostgreSQL is not installed (apt-get install postgresql).');
  return join(root, majors[0]!, 'bin');
}

const isRoot = () => process.getuid?.() === 0;

/** PostgreSQL refuses to run as root; then its programs run as the `postgres` user. */
function pgRun(bin: string, program: string, args: string[]) {
  const cmd = join(bin, program);
  if (isRoot()) execFileSync('runuser', ['-u', 'postgres', '--', cmd, ...args], { stdio: 'pipe' });
  else execFileSync(cmd, args, { stdio: 'pipe' });
}

async function startPostgres(dir: string) {
  const bin = findPgBin();
  const data = join(dir, 'pg');
  mkdirSync(data, { recursive: true });
  if (isRoot()) {
    // The postgres user must reach its folder inside ours.
    chmodSync(dir, 0o755);
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
    chownSync(data, uid, gid);
  }
  pgRun(bin, 'initdb', [
    '-D',
    data,
    '-U',
    'hoverprint',
    '--auth=trust',
    '-E',
    'UTF8',
    '--no-locale',
    '--no-sync',
  ]);
  const port = await freePort();
  // A throwaway instance: fsync off (only an OS crash could lose data, and then we start anew);
  // commits still wait for the WAL write, so a killed server loses nothing it acknowledged.
  const opts = [
    `-p ${port}`,
    `-k ${data}`,
    '-c listen_addresses=127.0.0.1',
    '-c fsync=off',
    '-c full_page_writes=off',
    '-c max_connections=300',
  ].join(' ');
  pgRun(bin, 'pg_ctl', ['-D', data, '-l', join(data, 'server.log'), '-o', opts, '-w', 'start']);
  const { default: pg } = await import('pg');
  const admin = new pg.Client({
    connectionString: `postgres://hoverprint@127.0.0.1:${port}/postgres`,
  });
  await admin.connect();
  await admin.query('CREATE DATABASE hoverprint');
  await admin.end();
  return { bin, port, url: `postgres://hoverprint@127.0.0.1:${port}/hoverprint` };
}

async function startRedis(dir: string) {
  const port = await freePort();
  const folder = join(dir, 'redis');
  mkdirSync(folder, { recursive: true });
  execFileSync(
    'redis-server',
    [
      '--port',
      String(port),
      '--bind',
      '127.0.0.1',
      '--save',
      '',
      '--appendonly',
      'no',
      '--daemonize',
      'yes',
      '--dir',
      folder,
      '--pidfile',
      join(folder, 'redis.pid'),
      '--logfile',
      join(folder, 'redis.log'),
    ],
    { stdio: 'pipe' },
  );
  await waitFor('redis-server', () => portOpen(port));
  return { port, url: `redis://127.0.0.1:${port}` };
}

async function startS3(dir: string) {
  const port = await freePort();
  const folder = join(dir, 's3');
  mkdirSync(folder, { recursive: true });
  // The real Node process (no wrapper that forks), detached so it outlives `services up`.
  const child = spawn(
    process.execPath,
    [
      '--import',
      'tsx',
      resolve('tests/services/s3-server.ts'),
      String(port),
      folder,
      SERVICES_BUCKET,
    ],
    { detached: true, stdio: 'ignore' },
  );
  child.unref();
  await waitFor('s3rver', () => portOpen(port));
  return { port, pid: child.pid!, endpoint: `http://127.0.0.1:${port}` };
}

/** Starts the three services in `dir` (which must exist) and records them there. */
export async function servicesUp(dir: string): Promise<ServicesState> {
  const pg = await startPostgres(dir);
  const redis = await startRedis(dir);
  const s3 = await startS3(dir);
  const state: ServicesState = {
    dir,
    pgBin: pg.bin,
    pgPort: pg.port,
    redisPort: redis.port,
    s3Port: s3.port,
    s3Pid: s3.pid,
    env: {
      DATABASE_URL: pg.url,
      S3_ENDPOINT: s3.endpoint,
      S3_BUCKET: SERVICES_BUCKET,
      S3_REGION: 'us-east-1',
      S3_FORCE_PATH_STYLE: '1',
      AWS_ACCESS_KEY_ID: S3RVER_KEY,
      AWS_SECRET_ACCESS_KEY: S3RVER_KEY,
      REDIS_URL: redis.url,
    },
  };
  writeFileSync(join(dir, STATE_FILE), JSON.stringify(state, null, 2));
  return state;
}

export function readState(dir: string): ServicesState {
  return JSON.parse(readFileSync(join(dir, STATE_FILE), 'utf8')) as ServicesState;
}

/** Stops what `servicesUp` started in `dir` and checks every port is closed. */
export async function servicesDown(dir: string): Promise<void> {
  const s = readState(dir);
  const problems: string[] = [];
  try {
    pgRun(s.pgBin, 'pg_ctl', ['-D', join(dir, 'pg'), '-m', 'fast', '-w', 'stop']);
  } catch (err) {
    problems.push(`pg_ctl stop: ${String(err)}`);
  }
  try {
    const pid = Number(readFileSync(join(dir, 'redis', 'redis.pid'), 'utf8'));
    process.kill(pid, 'SIGTERM');
  } catch (err) {
    problems.push(`redis: ${String(err)}`);
  }
  try {
    process.kill(s.s3Pid, 'SIGTERM');
  } catch (err) {
    problems.push(`s3rver: ${String(err)}`);
  }
  for (const [name, port] of [
    ['PostgreSQL', s.pgPort],
    ['Redis', s.redisPort],
    ['s3rver', s.s3Port],
  ] as const) {
    await waitFor(`${name} shutdown`, async () => !(await portOpen(port))).catch(() =>
      problems.push(`${name} still listens on ${port}`),
    );
  }
  if (problems.length > 0) throw new Error(problems.join('\n'));
}
