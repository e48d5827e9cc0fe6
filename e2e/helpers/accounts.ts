import { expect, type APIRequestContext, type Page } from '@playwright/test';

export const PASSWORD = 'props-off-on-the-bench';

/** A fresh address per run, so journeys never collide on a reused server. */
export function uniqueEmail(tag: string): string {
  return `${tag}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.org`;
}

/** Create an account through the sign-up page; lands on "Start a team" for a user with none. */
export async function signUp(page: Page, who: { name: string; email: string; password?: string }) {
  await page.goto('/sign-up');
  await page.getByLabel('Name').fill(who.name);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password ?? PASSWORD);
  await page.getByRole('button', { name: 'Create account' }).click();
}

export async function createTeam(page: Page, name: string) {
  await expect(page.getByRole('heading', { name: 'Start a team' })).toBeVisible();
  await page.getByLabel('Team name').fill(name);
  await page.getByRole('button', { name: 'Create team' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Fleet' })).toBeVisible();
}

/** Add an aircraft from a layout preset through the airframe editor; ends on its page. */
export async function addAircraftFromPreset(
  page: Page,
  aircraft: { name: string; preset: string; armMm?: number },
) {
  await page.getByRole('link', { name: 'Add aircraft' }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: 'Add aircraft' })).toBeVisible();
  await page.getByLabel('Aircraft name').fill(aircraft.name);
  await page.getByLabel('Layout preset').selectOption(aircraft.preset);
  if (aircraft.armMm !== undefined)
    await page.getByLabel('Arm, centre to motor (mm)').fill(String(aircraft.armMm));
  await page.getByRole('button', { name: 'Fill table from preset' }).click();
  await page.getByRole('button', { name: 'Add aircraft' }).click();
  await expect(page.getByRole('heading', { level: 1, name: aircraft.name })).toBeVisible();
}

export interface CaughtMail {
  subject: string;
  to: string[];
  text: string;
}

/** The newest message the fake SMTP server caught for an address (polls while mail is in flight). */
export async function mailTo(
  request: APIRequestContext,
  email: string,
  subject: RegExp,
): Promise<CaughtMail> {
  let found: CaughtMail | undefined;
  await expect
    .poll(
      async () => {
        const res = await request.get('/api/dev/mail');
        const body = (await res.json()) as { messages: CaughtMail[] };
        found = body.messages.find(
          (m) => m.to.some((t) => t.includes(email)) && subject.test(m.subject),
        );
        return Boolean(found);
      },
      { timeout: 15_000 },
    )
    .toBe(true);
  return found!;
}

/** First link into the app in a plain-text message, as a path for this server. */
export function linkIn(mail: CaughtMail, pathPrefix: string): string {
  const match = mail.text.match(new RegExp(`https?://[^\\s]+(${pathPrefix}[^\\s]*)`));
  if (!match) throw new Error(`no ${pathPrefix} link in "${mail.subject}":\n${mail.text}`);
  return match[1]!;
}

/** What the device's store says about flights not yet on the server (for failure messages). */
export async function localSyncErrors(page: Page): Promise<string> {
  return page.evaluate(
    () =>
      new Promise<string>((resolve) => {
        const open = indexedDB.open('hoverprint');
        open.onerror = () => resolve('cannot open the local database');
        open.onsuccess = () => {
          const all = open.result.transaction('flights').objectStore('flights').getAll();
          all.onsuccess = () =>
            resolve(
              JSON.stringify(
                (all.result as { fileName: string; syncState: string; lastError?: string }[]).map(
                  (f) => [f.fileName, f.syncState, f.lastError ?? null],
                ),
              ),
            );
        };
      }),
  );
}
