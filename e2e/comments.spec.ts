import { expect, test, type Browser, type BrowserContext } from '@playwright/test';
import { presetAirframe } from '../shared/airframe/presets';
import { PASSWORD, linkIn, mailTo, uniqueEmail } from './helpers/accounts';
import { writeScenarioCsv } from './fixtures/synth-log';

interface Member {
  context: BrowserContext;
  email: string;
  name: string;
}

async function signUpBy(
  browser: Browser,
  name: string,
  tag: string,
  inviteToken?: string,
): Promise<Member> {
  const context = await browser.newContext();
  const email = uniqueEmail(tag);
  const res = await context.request.post('/api/auth/sign-up', {
    data: { name, email, password: PASSWORD, ...(inviteToken ? { inviteToken } : {}) },
  });
  expect(res.ok(), await res.text()).toBe(true);
  return { context, email, name };
}

/** A team with an owner who flies (Kite's pilot), a coach and a viewer, all joined by invite. */
async function crew(browser: Browser) {
  const pilot = await signUpBy(browser, 'Rosa Kite', 'pilot');
  const team = (await (
    await pilot.context.request.post('/api/teams', { data: { name: 'Kite club' } })
  ).json()) as { id: string };
  const aircraftRes = await pilot.context.request.post(`/api/teams/${team.id}/aircraft`, {
    data: { name: 'Kite', airframe: presetAirframe('quad-x', { name: 'Kite 5-inch' }) },
  });
  expect(aircraftRes.ok(), await aircraftRes.text()).toBe(true);
  const join = async (name: string, role: 'coach' | 'viewer') => {
    const email = uniqueEmail(role);
    const inv = await pilot.context.request.post(`/api/teams/${team.id}/invites`, {
      data: { email, role },
    });
    expect(inv.ok(), await inv.text()).toBe(true);
    const mail = await mailTo(pilot.context.request, email, /invited you/);
    const token = linkIn(mail, '/invite/').split('/invite/')[1]!;
    const context = await browser.newContext();
    const res = await context.request.post('/api/auth/sign-up', {
      data: { name, email, password: PASSWORD, inviteToken: token },
    });
    expect(res.ok(), await res.text()).toBe(true);
    return { context, email, name };
  };
  return {
    pilot,
    team,
    coach: await join('Dev Heron', 'coach'),
    viewer: await join('Sam Osprey', 'viewer'),
  };
}

test('a coach comments at the moment of a finding; the pilot is mailed a link to that moment; a viewer only reads', async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const { pilot, coach, viewer } = await crew(browser);

  // The pilot imports a flight of Kite; it opens locally and the sync sends it to the team.
  const pilotPage = await pilot.context.newPage();
  await pilotPage.goto('/import');
  await pilotPage.getByLabel('Aircraft').selectOption({ label: 'Kite · 4 motors' });
  await pilotPage
    .getByLabel('Flight logs')
    .setInputFiles(writeScenarioCsv('worn-motor-3', { seconds: 30 }));
  await expect(pilotPage).toHaveURL(/\/flights\/[0-9a-f-]{36}/, { timeout: 60_000 });
  const flightId = new URL(pilotPage.url()).pathname.split('/')[2]!;
  await expect
    .poll(async () => (await pilot.context.request.get(`/api/flights/${flightId}`)).status(), {
      timeout: 60_000,
    })
    .toBe(200);

  // The pilot asks the coach for a review from the rail.
  await pilotPage.reload();
  await pilotPage.getByRole('button', { name: 'Request review' }).click();
  await expect(pilotPage.getByText('Review requested')).toBeVisible();
  const ask = await mailTo(pilot.context.request, coach.email, /asks you to review/);

  // The coach opens the flight from the e-mail, clicks the top finding and comments at its moment.
  const coachPage = await coach.context.newPage();
  await coachPage.goto(linkIn(ask, '/flights/'));
  const finding = coachPage.getByRole('list', { name: 'Findings' }).getByRole('listitem').first();
  await expect(finding).toContainText('Motor 3');
  await finding.getByRole('link').click();
  await expect(coachPage).toHaveURL(/\/balance\?t=/);
  const tS = Number(new URL(coachPage.url()).searchParams.get('t'));
  await expect(coachPage.getByTestId('cursor-readout')).toContainText(`t ${tS.toFixed(2)} s`);
  await expect(coachPage.getByText(`at ${tS.toFixed(2)} s`, { exact: true })).toBeVisible();
  await coachPage
    .getByRole('textbox', { name: 'Comment at the cursor' })
    .fill('Listen to motor 3 on the bench, props off.');
  await coachPage.getByRole('button', { name: 'Comment', exact: true }).click();
  const thread = coachPage.getByRole('article', {
    name: `Comment by Dev Heron at ${tS.toFixed(2)} s`,
  });
  await expect(thread).toContainText('Listen to motor 3');

  // The pilot's inbox has the notification; its link opens the review at the same moment.
  const note = await mailTo(pilot.context.request, pilot.email, /New comment/);
  expect(note.text).toContain('Listen to motor 3');
  await pilotPage.goto(linkIn(note, '/flights/'));
  await expect(pilotPage.getByTestId('cursor-readout')).toContainText(`t ${tS.toFixed(2)} s`);
  await expect(
    pilotPage.getByRole('article', { name: `Comment by Dev Heron at ${tS.toFixed(2)} s` }),
  ).toBeVisible();

  // A viewer reads the thread but has no comment box.
  const viewerPage = await viewer.context.newPage();
  await viewerPage.goto(`/flights/${flightId}`);
  await expect(viewerPage.getByRole('article', { name: /Comment by Dev Heron/ })).toBeVisible();
  await expect(viewerPage.getByRole('textbox', { name: 'Comment at the cursor' })).toHaveCount(0);
  await expect(viewerPage.getByRole('button', { name: 'Resolve' })).toHaveCount(0);
  await expect(viewerPage.getByRole('button', { name: 'Mark reviewed' })).toHaveCount(0);

  // The coach asks for changes with a note; the pilot is mailed it.
  await coachPage
    .getByLabel('Note to the pilot (optional)')
    .fill('Swap motor 3, then fly it again.');
  await coachPage.getByRole('button', { name: 'Ask for changes' }).click();
  await expect(coachPage.getByTestId('review-state')).toHaveText('Review: Changes asked for');
  const changes = await mailTo(pilot.context.request, pilot.email, /requests changes/);
  expect(changes.text).toContain('Swap motor 3, then fly it again.');

  // On the device that imported it the pilot sees where the review stands and asks again.
  await pilotPage.goto(`/flights/${flightId}`);
  await expect(pilotPage.getByTestId('review-state')).toHaveText('Review: Changes asked for');
  await pilotPage.getByRole('button', { name: 'Request review' }).click();
  await expect(pilotPage.getByTestId('review-state')).toHaveText('Review: Awaiting review');

  // The coach closes the review; the pilot is mailed and the fleet's filter finds it reviewed.
  await coachPage.reload();
  await expect(coachPage.getByTestId('review-state')).toHaveText('Review: Awaiting review');
  await coachPage.getByRole('button', { name: 'Mark reviewed' }).click();
  await expect(coachPage.getByTestId('review-state')).toHaveText('Review: Reviewed');
  await mailTo(pilot.context.request, pilot.email, /reviewed/);
  await coachPage.goto('/?review=reviewed');
  await expect(coachPage.getByRole('table', { name: 'Flights' })).toContainText('Kite');
});
