import { createHash } from 'node:crypto';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { DataSource } from 'typeorm';
import { analyzeFlight } from '../../shared/analysis/analyze-flight';
import { DEMO_PASSWORD, demoMembers, demoTeam } from '../../shared/sim/demo/crew';
import { demoComments } from '../../shared/sim/demo/comments';
import { demoFleet } from '../../shared/sim/demo/fleet';
import { demoBenchRuns } from '../../shared/sim/demo/bench-runs';
import { demoFlights, demoServiceLog } from '../../shared/sim/demo/flights';
import { demoFlightLog } from '../../shared/sim/demo/demo-flight-log';
import { writeCanonicalCsvBytes } from '../../shared/sim/csv-writer';
import { User } from '../auth/user.entity';
import type { Services } from '../services';
import { Membership } from '../teams/membership.entity';

export interface DemoLoadResult {
  loaded: boolean;
  flights: number;
  comments: number;
}

/**
 * A stable UUID per demo object, so loading twice finds the same rows and the flight and
 * comment PUTs stay idempotent (RFC 9562 layout, version nibble 4, variant 10).
 */
export function demoId(kind: string, index: number): string {
  const h = createHash('sha256').update(`hoverprint-demo:${kind}:${index}`).digest('hex');
  const variant = ((parseInt(h[16]!, 16) & 0x3) | 0x8).toString(16);
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-${variant}${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

/**
 * Loads the demo crew, fleet, flights (synthesised, analysed with the same engine the browser
 * runs, raw logs stored) and coach comments. Does nothing when the demo owner already exists.
 * Pass services built on a memory mailer: a demo load should not fill real inboxes.
 */
export async function loadDemo(
  dataSource: DataSource,
  services: Services,
): Promise<DemoLoadResult> {
  const owner = demoMembers.find((m) => m.role === 'owner');
  if (!owner) throw new Error('The demo crew has no owner.');
  const users = dataSource.getRepository(User);
  if (await users.findOneBy({ email: owner.email }))
    return { loaded: false, flights: 0, comments: 0 };

  const userIds = new Map<string, string>();
  for (const member of demoMembers) {
    userIds.set(
      member.key,
      await services.auth.signUp({
        email: member.email,
        password: DEMO_PASSWORD,
        name: member.name,
      }),
    );
  }
  const idOf = (key: string) => {
    const id = userIds.get(key);
    if (!id) throw new Error(`Demo data names an unknown member "${key}".`);
    return id;
  };

  const team = await services.teams.create(idOf(owner.key), demoTeam.name);
  // Members join directly: the invite flow would mail every demo address.
  const memberships = dataSource.getRepository(Membership);
  for (const member of demoMembers) {
    if (member.key === owner.key) continue;
    await memberships.insert({
      teamId: team.id,
      userId: idOf(member.key),
      role: member.role,
      joinedAt: Date.now(),
    });
  }

  const aircraftIds = new Map<string, string>();
  for (const aircraft of demoFleet) {
    const created = await services.aircraft.create(idOf(owner.key), team.id, {
      name: aircraft.name,
      airframe: aircraft.airframe,
      ...componentsOf(aircraft.components),
    });
    aircraftIds.set(aircraft.key, created.id);
  }

  for (const entry of demoServiceLog) {
    await services.aircraft.addServiceEntry(idOf(entry.author), aircraftIds.get(entry.aircraft)!, {
      date: entry.date.slice(0, 10),
      kind: entry.kind,
      motor: entry.motor,
      note: `${entry.title}. ${entry.body}`,
    });
  }
  for (const b of demoBenchRuns)
    await services.aircraft.addBenchRun(idOf(b.author), aircraftIds.get(b.aircraft)!, b.run);

  const staging = await mkdtemp(join(tmpdir(), 'hoverprint-demo-'));
  const flightIds: string[] = [];
  try {
    for (const flight of demoFlights) {
      const aircraft = demoFleet.find((a) => a.key === flight.aircraft)!;
      const { log } = demoFlightLog(flight);
      const bytes = concat([...writeCanonicalCsvBytes(log, { metadata: log.metadata })]);
      const sha256 = createHash('sha256').update(bytes).digest('hex');
      const { report, detail } = analyzeFlight(log, { airframe: aircraft.airframe });
      const id = demoId('flight', flight.index);
      const pilotId = idOf(flight.pilot);
      await services.flights.put(pilotId, id, {
        teamId: team.id,
        aircraftId: aircraftIds.get(flight.aircraft)!,
        recordedAt: flight.date,
        fileName: flight.fileName,
        sha256,
        sizeBytes: bytes.byteLength,
        report,
        detail,
      });
      const path = join(staging, `${id}.csv`);
      await writeFile(path, bytes);
      await services.rawLogs.attach(pilotId, id, {
        path,
        size: bytes.byteLength,
        sha256,
        gzip: false,
        originalName: flight.fileName,
      });
      flightIds.push(id);
    }
  } finally {
    await rm(staging, { recursive: true, force: true });
  }

  let comments = 0;
  for (const [i, c] of demoComments.entries()) {
    const flightId = flightIds[c.flight];
    if (!flightId) throw new Error(`Demo comment ${i} points at missing flight ${c.flight}.`);
    const rootId = demoId('comment', i * 100);
    await services.comments.put(idOf(c.author), rootId, {
      flightId,
      tS: c.tS,
      body: c.body,
      mentions: (c.mentions ?? []).map(idOf),
    });
    comments++;
    for (const [j, reply] of (c.replies ?? []).entries()) {
      await services.comments.put(idOf(reply.author), demoId('comment', i * 100 + j + 1), {
        flightId,
        tS: c.tS,
        body: reply.body,
        parentId: rootId,
      });
      comments++;
    }
    if (c.resolvedBy) await services.comments.patch(idOf(c.resolvedBy), rootId, { resolved: true });
  }
  // Reviews asked for and closed, so a coach finds one waiting and the loop shows its end.
  for (const flight of demoFlights) {
    if (!flight.review) continue;
    const id = flightIds[flight.index]!;
    const coachId = idOf(flight.review.coach);
    await services.reviews.requestReview(idOf(flight.pilot), id, { userIds: [coachId] });
    if (flight.review.outcome)
      await services.reviews.setReview(coachId, id, {
        state: flight.review.outcome,
        ...(flight.review.note ? { note: flight.review.note } : {}),
      });
  }
  return { loaded: true, flights: flightIds.length, comments };
}

const componentFields: Record<string, 'frame' | 'motors' | 'props' | 'esc' | 'battery'> = {
  Frame: 'frame',
  Motors: 'motors',
  Props: 'props',
  ESC: 'esc',
  Battery: 'battery',
};

/** The demo's parts list as the aircraft's component fields; the rest (camera, payload) as notes. */
function componentsOf(parts: { part: string; detail: string }[]) {
  const components: Partial<Record<'frame' | 'motors' | 'props' | 'esc' | 'battery', string>> = {};
  const notes: string[] = [];
  for (const { part, detail } of parts) {
    const field = componentFields[part];
    if (field) components[field] = detail;
    else notes.push(`${part}: ${detail}`);
  }
  return { components, notes: notes.join('\n') };
}

function concat(chunks: Uint8Array[]): Uint8Array {
  let total = 0;
  for (const c of chunks) total += c.byteLength;
  const out = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    out.set(c, offset);
    offset += c.byteLength;
  }
  return out;
}
