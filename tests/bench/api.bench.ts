/**
 * API load (targets: tests/bench/README.md §1.4): comment writes per second and a paginated
 * flight list over 10 k stored flights, against the real server process on loopback with a
 * fresh SQLite file. Reference in the same run: `GET /api/health` (one trivial query), so the
 * ratios say how much of the machine's request budget a write or a list page costs. Bounded in
 * count and time.
 *
 * With `--engine postgres` the server keeps its data in PostgreSQL, its raw logs in S3 and its
 * rate limits in Redis: those of DATABASE_URL, S3_* and REDIS_URL when set, else throwaway ones
 * it starts (tests/services/local-services.ts) and stops. Same figures, same reference.
 *
 * Throughput is measured closed-loop with autocannon (10 connections, as fast as the server
 * answers), timed to 50 ms (autocannon only stops on a sample tick, 1 s by default).
 *
 * Latency is measured at a fixed offered rate — 500 writes/s (the target rate) and 200 list
 * pages/s — two ways, both printed:
 * - autocannon's `overallRate`: each of 10 connections sends its share of the second back to
 *   back, then waits for the next second, so the load arrives as a burst of 10 concurrent
 *   requests at the top of every second. Its coordinated-omission correction takes 1/rate in
 *   seconds, rounded up to 1 ms, as the expected interval.
 * - paced: one request every 1/rate s on a timer, over as many keep-alive sockets as needed,
 *   each latency counted from when the request was due (so a late send counts against it).
 *   This is the load the target describes; the burst figure is kept to compare with past runs.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { parseConfig } from '../../server/config';
import { openDatabase } from '../../server/db/data-source';
import { FlightPayload } from '../../server/flights/flight-payload.entity';
import { Flight } from '../../server/flights/flight.entity';
import { findingStats, trendOf } from '../../server/flights/flight-summary';
import { createMemoryMailer } from '../../server/mail/mailer';
import { createServices } from '../../server/services';
import { kite, report } from '../server/helpers/fixtures';
import { freshStores, type Stores } from '../server/helpers/engine';
import { spawnServer } from '../server/helpers/spawn-server';
import { servicesDown, servicesUp } from '../services/local-services';
import { paced } from './paced';
import { processCpuMs, processTreeCpuMs } from './process-cpu';
import type { Bench, BenchOptions } from './registry';

interface Histogram {
  average: number;
  p50: number;
  p99: number;
}
interface Result {
  latency: Histogram;
  requests: Histogram & { total: number };
  duration: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  '2xx': number;
}
interface Request {
  method?: string;
  path?: string;
  body?: string;
  headers?: Record<string, string>;
}
type Autocannon = (opts: {
  url: string;
  connections: number;
  duration: number;
  amount?: number;
  headers?: Record<string, string>;
  overallRate?: number;
  sampleInt?: number;
  requests: { method?: string; setupRequest?: (req: Request) => Request }[];
}) => Promise<Result>;
// autocannon ships no types; only this file uses it.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const FLIGHTS = 10_000;
const PASSWORD = 'bench passphrase long';

/** The stores, and the PostgreSQL postmaster's pid when the benchmark started it itself. */
type BenchStores = Stores & { postmasterPid?: number };

/** A fresh database and bucket on PostgreSQL, S3 and Redis; services started when none run. */
async function postgresStores(log: (s: string) => void): Promise<BenchStores> {
  if (process.env.DATABASE_URL) return freshStores();
  const dir = mkdtempSync(join(tmpdir(), 'hoverprint-bench-services-'));
  log('starting throwaway PostgreSQL, Redis and S3…');
  const state = await servicesUp(dir);
  Object.assign(process.env, state.env);
  const stores = await freshStores();
  return {
    env: stores.env,
    postmasterPid: Number(readFileSync(join(dir, 'pg', 'postmaster.pid'), 'utf8').split('\n')[0]),
    async cleanup() {
      await stores.cleanup();
      await servicesDown(dir);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

async function seed(dataDir: string, env: Record<string, string>) {
  const config = parseConfig({ NODE_ENV: 'test', DATA_DIR: dataDir, ...env });
  const { dataSource } = await openDatabase(config);
  const services = createServices(dataSource, config, createMemoryMailer());
  const userId = await services.auth.signUp({
    email: 'mara@crew.example',
    password: PASSWORD,
    name: 'Mara',
  });
  const team = await services.teams.create(userId, 'Club and filming crew');
  const aircraft = await services.aircraft.create(userId, team.id, kite);
  const r = report();
  const { counts, worst } = findingStats(r);
  const common = {
    teamId: team.id,
    aircraftId: aircraft.id,
    pilotId: userId,
    durationS: r.durationS,
    sampleRateHz: r.sampleRateHz,
    fileName: 'kite.csv',
    sizeBytes: 1_000_000,
    rawKey: null,
    rawGzip: false,
    reportVersion: r.version,
    trend: JSON.stringify(trendOf(r)),
    worstSeverity: worst,
    noteCount: counts.note,
    watchCount: counts.watch,
    actCount: counts.act,
    commentCount: 0,
    openComments: 0,
    reviewState: 'none',
    note: '',
  };
  const start = Date.UTC(2025, 0, 1);
  const repo = dataSource.getRepository(Flight);
  await dataSource.transaction(async (em) => {
    for (let i = 0; i < FLIGHTS; i += 500) {
      const rows = Array.from({ length: Math.min(500, FLIGHTS - i) }, (_, k) => ({
        ...common,
        id: randomUUID(),
        sha256: (i + k).toString(16).padStart(64, '0'),
        recordedAt: start + (i + k) * 3_600_000,
        createdAt: Date.now(),
        updatedAt: Date.now(),
      }));
      await em.getRepository(Flight).insert(rows);
      await em
        .getRepository(FlightPayload)
        .insert(rows.map((f) => ({ flightId: f.id, report: JSON.stringify(r), detail: null })));
    }
  });
  // Fresh statistics, as autovacuum would gather within a minute of a bulk load; without them
  // PostgreSQL plans the list as a scan and sort of all 10 k rows (postgresql.org/docs/15/
  // populate.html §14.4.9). SQLite's planner needs no statistics for these indexes.
  if (dataSource.options.type === 'postgres') await dataSource.query('ANALYZE');
  const flightId = (
    await repo.findOneOrFail({
      where: { teamId: team.id },
      select: { id: true },
      order: { recordedAt: 'DESC' },
    })
  ).id;
  await services.rateLimits.close();
  await dataSource.destroy();
  return { teamId: team.id, flightId };
}

async function signIn(url: string) {
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'mara@crew.example', password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.get('set-cookie')!.split(';')[0]!;
}

/** Walks the list once to collect cursors spread over all 10 k flights. */
async function cursors(url: string, cookie: string, teamId: string) {
  const out: string[] = [''];
  let cursor: string | null = null;
  do {
    const q: string = `limit=200${cursor ? `&cursor=${cursor}` : ''}`;
    const res = await fetch(`${url}/api/teams/${teamId}/flights?${q}`, { headers: { cookie } });
    const body = (await res.json()) as { nextCursor: string | null };
    cursor = body.nextCursor;
    if (cursor) out.push(cursor);
  } while (cursor);
  return out;
}

/**
 * CPU milliseconds per request over one run: the server process, the database's processes (when
 * the benchmark started PostgreSQL; SQLite works inside the server) and this load generator.
 */
function cpuMeter(serverPid: number, postmasterPid: number | undefined) {
  const read = () => ({
    server: processCpuMs(serverPid),
    database: postmasterPid === undefined ? null : processTreeCpuMs(postmasterPid),
    client: process.cpuUsage(),
  });
  const start = read();
  return (requests: number) => {
    const end = read();
    const per = (a: number | null, b: number | null) =>
      a === null || b === null ? null : Number(((b - a) / requests).toFixed(2));
    const client = process.cpuUsage(start.client);
    return {
      server: per(start.server, end.server),
      database: per(start.database, end.database),
      client: Number(((client.user + client.system) / 1000 / requests).toFixed(2)),
    };
  };
}

type CpuPerRequest = ReturnType<ReturnType<typeof cpuMeter>>;

const describeCpu = (c: CpuPerRequest) =>
  `CPU per request: server ${c.server ?? '?'} ms` +
  (c.database === null ? '' : `, PostgreSQL ${c.database} ms`) +
  `, load generator ${c.client} ms`;

/** `writeServerCpuMs` and the like, leaving out what could not be measured. */
function flatCpu(prefix: string, c: CpuPerRequest): Record<string, number> {
  const out: Record<string, number> = {};
  if (c.server !== null) out[`${prefix}ServerCpuMs`] = c.server;
  if (c.database !== null) out[`${prefix}DatabaseCpuMs`] = c.database;
  out[`${prefix}ClientCpuMs`] = c.client;
  return out;
}

function check(name: string, r: Result) {
  if (r.errors || r.timeouts || r.non2xx) {
    throw new Error(
      `${name}: ${r.errors} errors, ${r.timeouts} timeouts, ${r.non2xx} non-2xx responses`,
    );
  }
}

const bench: Bench = async ({ json, dir, engine }: BenchOptions) => {
  const dataDir = mkdtempSync(join(dir, 'api-'));
  const log = (s: string) => {
    if (!json) console.log(s);
  };
  const stores: BenchStores =
    engine === 'postgres' ? await postgresStores(log) : { env: {}, cleanup: async () => undefined };
  const server = await (async () => {
    log(`seeding ${FLIGHTS} flights (${engine})…`);
    const seeded = await seed(dataDir, stores.env);
    const s = await spawnServer({
      ...stores.env,
      DATA_DIR: dataDir,
      LOG_LEVEL: process.env.BENCH_LOG_LEVEL ?? 'info',
    });
    return { ...s, ...seeded };
  })().catch(async (err: unknown) => {
    await stores.cleanup();
    throw err;
  });
  try {
    const cookie = await signIn(server.url);
    const headers = { cookie, 'content-type': 'application/json' };
    const base = { url: server.url, connections: 10, headers };
    // Closed-loop runs end on a sample tick; a short one times them to 50 ms, not 1 s.
    const closed = { ...base, sampleInt: 50 };

    // Warm up the JIT and SQLite page cache.
    await autocannon({
      ...base,
      duration: 2,
      amount: 500,
      requests: [{ method: 'GET', setupRequest: (r) => ({ ...r, path: '/api/health' }) }],
    });

    const health = await autocannon({
      ...closed,
      duration: 8,
      amount: 8000,
      requests: [{ setupRequest: (r) => ({ ...r, method: 'GET', path: '/api/health' }) }],
    });
    check('health', health);

    let t = 0;
    const writeRequest = (r: Request): Request => ({
      ...r,
      method: 'PUT',
      path: `/api/comments/${randomUUID()}`,
      body: JSON.stringify({
        flightId: server.flightId,
        tS: (t++ % 1800) / 10,
        body: 'Motor 3 runs warm after the punch-out; check the bearing.',
      }),
    });
    const writeCpu = cpuMeter(server.child.pid!, stores.postmasterPid);
    const writes = await autocannon({
      ...closed,
      duration: 8,
      amount: 6000,
      requests: [{ setupRequest: writeRequest }],
    });
    check('comment writes', writes);
    const writeCpuMs = writeCpu(writes['2xx']);
    const writesAt500 = await autocannon({
      ...base,
      duration: 8,
      overallRate: 500,
      requests: [{ setupRequest: writeRequest }],
    });
    check('comment writes at 500/s', writesAt500);
    const writesPaced = await paced(server.url, 500, 8, headers, () => {
      const r = writeRequest({});
      return { method: r.method!, path: r.path!, body: r.body! };
    });
    if (writesPaced.failed)
      throw new Error(
        `paced comment writes: ${writesPaced.failed} failed (${JSON.stringify(writesPaced.reasons)})`,
      );

    const pages = await cursors(server.url, cookie, server.teamId);
    let p = 0;
    const listRequest = (r: Request): Request => {
      const c = pages[p++ % pages.length]!;
      return {
        ...r,
        method: 'GET',
        path: `/api/teams/${server.teamId}/flights?limit=50${c ? `&cursor=${c}` : ''}`,
      };
    };
    const listCpu = cpuMeter(server.child.pid!, stores.postmasterPid);
    const list = await autocannon({
      ...closed,
      duration: 8,
      amount: 4000,
      requests: [{ setupRequest: listRequest }],
    });
    check('flight list', list);
    const listCpuMs = listCpu(list['2xx']);
    const listAt200 = await autocannon({
      ...base,
      duration: 8,
      overallRate: 200,
      requests: [{ setupRequest: listRequest }],
    });
    check('flight list at 200/s', listAt200);
    const listPaced = await paced(server.url, 200, 8, headers, () => {
      const r = listRequest({});
      return { method: r.method!, path: r.path! };
    });
    if (listPaced.failed)
      throw new Error(
        `paced flight list: ${listPaced.failed} failed (${JSON.stringify(listPaced.reasons)})`,
      );

    const perS = (r: Result) => r['2xx'] / r.duration;
    const figures = {
      writesPerS: Math.round(perS(writes)),
      writeP99Ms: writesAt500.latency.p99,
      writeP99PacedMs: writesPaced.p99,
      listP99Ms: listAt200.latency.p99,
      listP99PacedMs: listPaced.p99,
      ...flatCpu('write', writeCpuMs),
      ...flatCpu('list', listCpuMs),
    };
    const ref = perS(health);
    log(
      `reference GET /api/health: ${Math.round(ref)} req/s (closed loop, 10 connections), p50 ${health.latency.p50} ms, p99 ${health.latency.p99} ms`,
    );
    log(
      `comment writes: ${figures.writesPerS} /s closed loop (${(perS(writes) / ref).toFixed(2)}× health); at 500 /s offered — paced: p50 ${writesPaced.p50} ms, p99 ${writesPaced.p99} ms, max ${writesPaced.max} ms; in per-second bursts on 10 connections: p50 ${writesAt500.latency.p50} ms, p99 ${writesAt500.latency.p99} ms — target ≥ 500 /s with p99 ≤ 50 ms; closed-loop ${describeCpu(writeCpuMs)}`,
    );
    log(
      `flight list, 50 a page over ${FLIGHTS} flights (${pages.length} cursors): ${Math.round(perS(list))} /s closed loop (${(perS(list) / ref).toFixed(2)}× health); at 200 /s offered — paced: p50 ${listPaced.p50} ms, p99 ${listPaced.p99} ms, max ${listPaced.max} ms; in per-second bursts on 10 connections: p50 ${listAt200.latency.p50} ms, p99 ${listAt200.latency.p99} ms — target p99 ≤ 30 ms; closed-loop ${describeCpu(listCpuMs)}`,
    );
    return figures;
  } finally {
    await server.stop();
    await stores.cleanup();
    rmSync(dataDir, { recursive: true, force: true });
  }
};

export default bench;
