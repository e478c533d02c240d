import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';

// The whole invitation path through the real client, server, MariaDB and SMTP
// sink: a supervisor adds someone new to the demo project, the invitation
// lands in the development mailbox, the new person follows its link, chooses
// a password and signs in as a student of that project.

const PROJECT = 'Micelle formers';
const NEWCOMER = { email: 'rowan.vell@example.org', name: 'Rowan Vell', password: 'a-long-new-password-42' };

const session = browserSession();
const pageErrors: string[] = [];

async function newPage(): Promise<Page> {
  const page = await (await session.context()).newPage();
  page.setDefaultTimeout(15_000);
  page.on('pageerror', (error) => pageErrors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') pageErrors.push(message.text());
  });
  return page;
}

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

beforeAll(() => session.open());
afterAll(() => session.close());

describe('inviting a new member', () => {
  // Many page loads and three bcrypt runs: on a busy 2-core machine this takes over a minute.
  it('goes from a supervisor adding an address to the newcomer signed in', { timeout: 120_000 }, async () => {
    // The supervisor: a signed-out visit lands on sign-in, then on the projects.
    const supervisor = await newPage();
    await supervisor.goto('/');
    await supervisor.waitForURL(/\/sign-in/);
    await signIn(supervisor, 'supervisor@example.org', 'beadloom-demo');
    await supervisor.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    await expect(supervisor.getByRole('link', { name: /Dr Ines Marlow/ }).count()).resolves.toBe(1);

    await supervisor.getByRole('link', { name: new RegExp(PROJECT) }).click();
    await supervisor.getByRole('heading', { level: 1, name: PROJECT }).waitFor();
    await supervisor.getByRole('list', { name: 'Molecules' }).getByText('Ibuprofen').waitFor();

    const addForm = supervisor.getByRole('form', { name: 'Add a member' });
    await addForm.getByLabel('Member e-mail').fill(NEWCOMER.email);
    await addForm.getByLabel('Member role').selectOption('student');
    await addForm.getByLabel('Member name').fill(NEWCOMER.name);
    await addForm.getByRole('button', { name: 'Add member' }).click();
    await addForm.getByRole('status').filter({ hasText: `${NEWCOMER.email} is invited` }).waitFor();

    const row = supervisor.getByRole('list', { name: 'Members' }).getByRole('listitem', { name: NEWCOMER.name });
    await row.getByText('Invited').waitFor();
    await expect(row.getByLabel(`Role of ${NEWCOMER.name}`).inputValue()).resolves.toBe('student');

    // The invitation is in the dev mailbox, which only the site admin may read: a signed-out browser
    // gets the unknown-route 404. The newcomer, in a browser of their own, follows the link the
    // admin reads there (the page itself is tested in tests/api/dev-mail.test.ts).
    const newcomer = await newPage();
    const refused = await newcomer.goto('/dev/mail');
    expect(refused?.status()).toBe(404);
    const invitation = (await session.mail()).filter((m) => m.to.includes(NEWCOMER.email) && /set your password/i.test(m.subject));
    expect(invitation).toHaveLength(1);
    const href = /(\S+\/reset-password\?token=\S+)/.exec(invitation[0].text)?.[1];
    expect(href).toMatch(new RegExp(`^${session.url}/reset-password\\?token=[^&\\s]{20,}$`));
    await newcomer.goto(href!);

    await newcomer.getByRole('heading', { level: 1, name: 'Choose a password' }).waitFor();
    // The shared schema's rule shows inline before anything is sent.
    await newcomer.getByLabel('New password').fill('short');
    await newcomer.getByRole('button', { name: 'Set password' }).click();
    const tooShort = newcomer.getByText('A password has at least 10 characters.');
    await tooShort.waitFor();
    await expect(newcomer.getByLabel('New password').getAttribute('aria-invalid')).resolves.toBe('true');

    await newcomer.getByLabel('New password').fill(NEWCOMER.password);
    await newcomer.getByLabel('Repeat the password').fill(NEWCOMER.password);
    await newcomer.getByRole('button', { name: 'Set password' }).click();
    // Setting the password signs the newcomer in (issue 13, point 9).
    await newcomer.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    await newcomer.getByText('Your password is set and you are signed in.').waitFor();
    await newcomer.getByRole('link', { name: new RegExp(`Your account \\(${NEWCOMER.name}\\)`) }).waitFor();

    const card = newcomer.getByRole('link', { name: new RegExp(PROJECT) });
    await card.getByText('Student').waitFor();
    await card.click();
    await newcomer.getByRole('heading', { level: 1, name: PROJECT }).waitFor();
    await newcomer.getByRole('list', { name: 'Members' }).getByRole('listitem', { name: NEWCOMER.name }).waitFor();
    // A student may read the project but not manage its members.
    await expect(newcomer.getByRole('form', { name: 'Add a member' }).count()).resolves.toBe(0);
    await expect(newcomer.getByRole('button', { name: /^Remove / }).count()).resolves.toBe(0);

    // Back on the supervisor's page, the newcomer is no longer just invited.
    await supervisor.reload();
    await row.getByLabel(`Role of ${NEWCOMER.name}`).waitFor();
    await expect(row.getByText('Invited').count()).resolves.toBe(0);

    // The invitation link works once.
    await newcomer.goto(href!);
    await newcomer.getByLabel('New password').fill('another-password-77');
    await newcomer.getByLabel('Repeat the password').fill('another-password-77');
    await newcomer.getByRole('button', { name: 'Set password' }).click();
    await newcomer.getByRole('alert').waitFor();
    expect(newcomer.url()).toContain('/reset-password');

    // The only failed requests the browser may report are the deliberate ones:
    // the signed-out first visit (401), the refused mailbox (404) and the reused link (400).
    const expected = /^Failed to load resource: the server responded with a status of (400|401|404)/;
    expect(pageErrors.filter((e) => !expected.test(e))).toEqual([]);
  });
});
