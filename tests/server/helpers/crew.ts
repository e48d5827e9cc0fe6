import { randomUUID } from 'node:crypto';
import type { Role } from '../../../shared/schemas/common';
import { flightBody, kite } from './fixtures';
import { addMember } from './sql';
import { signedUpAgent, type TestApp } from './test-app';

export type Agent = Awaited<ReturnType<typeof signedUpAgent>>;

/**
 * A team whose owner is signed up over HTTP, with one more signed-up member per role asked for
 * (names are the demo crew's style: one word each), and one aircraft.
 */
export async function crew<const R extends Exclude<Role, 'owner'>>(
  t: TestApp,
  roles: readonly R[],
): Promise<{ owner: Agent; teamId: string; aircraftId: string } & Record<R, Agent>> {
  const owner = await signedUpAgent(t.app, 'Mara');
  const teamId = (await t.services.teams.create(owner.id, 'Tern Field Flyers')).id;
  const members = {} as Record<R, Agent>;
  for (const role of roles) {
    const agent = await signedUpAgent(t.app, role[0]!.toUpperCase() + role.slice(1));
    await addMember(t.dataSource, teamId, agent.id, role);
    members[role] = agent;
  }
  const aircraftId = (await t.services.aircraft.create(owner.id, teamId, kite)).id;
  return { owner, teamId, aircraftId, ...members };
}

/** A flight uploaded by `pilotId` through the service (no raw log). */
export async function flightBy(
  t: TestApp,
  pilotId: string,
  teamId: string,
  aircraftId: string,
): Promise<string> {
  const id = randomUUID();
  await t.services.flights.put(pilotId, id, flightBody(teamId, aircraftId));
  return id;
}

/** Every message the app's mailer has sent so far, once queued work is done. */
export async function sentMail(t: TestApp) {
  await t.mailer.idle();
  return t.mailer.inbox!.messages();
}
