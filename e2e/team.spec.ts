import { mkdirSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { createTeam, linkIn, mailTo, signUp, uniqueEmail } from './helpers/accounts';

test('the owner invites a coach, who joins through the link in the dev inbox and sees a coach view', async ({
  browser,
}) => {
  const owner = await browser.newPage();
  const ownerEmail = uniqueEmail('owner');
  const coachEmail = uniqueEmail('coach');
  await signUp(owner, { name: 'Tamsin Reed', email: ownerEmail });
  await createTeam(owner, 'Osprey survey');

  await owner.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
  const invite = owner.getByRole('form', { name: 'Invite' });
  await invite.getByLabel('E-mail').fill(coachEmail);
  await invite.getByLabel('Role').selectOption('coach');
  await invite.getByRole('button', { name: 'Send invite' }).click();
  await expect(owner.getByText(`Invitation e-mailed to ${coachEmail}`)).toBeVisible();
  // The owner also gets the link to pass on by hand.
  const sent = owner.getByRole('status').filter({ hasText: 'Invitation e-mailed' });
  await expect(sent).toContainText('You can also pass on the link:');
  const shown = await sent.textContent();
  await expect(owner.getByRole('table', { name: 'Invitations' })).toContainText(coachEmail);

  // The dev inbox shows the caught message with its link.
  await owner
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: 'Inbox' })
    .click();
  await expect(owner.getByRole('list', { name: 'Messages' })).toContainText(coachEmail);
  const mail = await mailTo(owner.request, coachEmail, /invit|join/i);
  const link = linkIn(mail, '/invite/');
  expect(shown).toContain(link);

  // The coach opens the link in a browser of their own and signs up from it.
  const coachContext = await browser.newContext();
  const coach = await coachContext.newPage();
  await coach.goto(link);
  await expect(coach.getByText('Osprey survey')).toBeVisible();
  await expect(coach.getByText(/as Coach/)).toBeVisible();
  await coach.getByLabel('Name').fill('Dov Kettering');
  await coach.getByLabel('Password').fill('reviews-every-sunday');
  await coach.getByRole('button', { name: 'Create account' }).click();
  await expect(coach.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
  await expect(coach.getByRole('combobox', { name: 'Team' })).toContainText(
    'Osprey survey · Coach',
  );
  // A coach cannot add aircraft or manage people.
  await expect(coach.getByRole('link', { name: 'Add aircraft' })).toHaveCount(0);
  await coach.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
  await expect(coach.getByRole('table', { name: 'Members' })).toContainText('Tamsin Reed');
  await expect(coach.getByRole('form', { name: 'Invite' })).toHaveCount(0);
  await expect(coach.getByRole('button', { name: 'Save thresholds' })).toHaveCount(0);
  // What a coach may not change reads as text: no input box around the thresholds.
  const limit = coach.getByLabel('Shortest hover stretch (s)');
  await expect(limit).toBeDisabled();
  expect(await limit.evaluate((el) => getComputedStyle(el).borderTopColor)).toBe(
    'rgba(0, 0, 0, 0)',
  );
  expect(await limit.evaluate((el) => getComputedStyle(el).backgroundColor)).toBe(
    'rgba(0, 0, 0, 0)',
  );

  // The owner sees the new member and can change the role.
  await owner.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
  const members = owner.getByRole('table', { name: 'Members' });
  await expect(members).toContainText('Dov Kettering');
  await members.getByLabel('Role of Dov Kettering').selectOption('tuner');
  await expect(members.getByLabel('Role of Dov Kettering')).toHaveValue('tuner');
  const artifacts = new URL('./artifacts/', import.meta.url).pathname;
  mkdirSync(artifacts, { recursive: true });
  await owner.setViewportSize({ width: 1280, height: 900 });
  await owner.screenshot({ path: `${artifacts}team-desktop.png`, fullPage: true });
  await coachContext.close();
});

test('the owner withdraws an invitation, and its link then says so and lets nobody in', async ({
  browser,
}) => {
  const owner = await browser.newPage();
  const guestEmail = uniqueEmail('guest');
  await signUp(owner, { name: 'Tamsin Reed', email: uniqueEmail('owner') });
  await createTeam(owner, 'Heron filming');
  await owner.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
  const invite = owner.getByRole('form', { name: 'Invite' });
  await invite.getByLabel('E-mail').fill(guestEmail);
  await invite.getByRole('button', { name: 'Send invite' }).click();
  const invitations = owner.getByRole('table', { name: 'Invitations' });
  const row = invitations.getByRole('row').filter({ hasText: guestEmail });
  await expect(row).toContainText('open until');
  const mail = await mailTo(owner.request, guestEmail, /invit|join/i);
  const link = linkIn(mail, '/invite/');

  // Declining the confirmation leaves it open; accepting it withdraws.
  owner.once('dialog', (d) => void d.dismiss());
  await row.getByRole('button', { name: /^Withdraw/ }).click();
  await expect(row).toContainText('open until');
  owner.once('dialog', (d) => {
    expect(d.message()).toContain(guestEmail);
    void d.accept();
  });
  await row.getByRole('button', { name: /^Withdraw/ }).click();
  await expect(row).toContainText('withdrawn');
  await expect(row.getByRole('button', { name: /^Withdraw/ })).toHaveCount(0);

  const guestContext = await browser.newContext();
  const guest = await guestContext.newPage();
  await guest.goto(link);
  await expect(guest.getByText('This invitation was withdrawn by the team owner.')).toBeVisible();
  await expect(guest.getByRole('button', { name: 'Create account' })).toHaveCount(0);
  await guestContext.close();
});
