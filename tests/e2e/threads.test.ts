import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession } from '../helpers/browser-session';

// A thread on a bead, end to end in Chromium: the modeller mentions the supervisor on a bead; the
// supervisor's bell shows it live; the e-mail's link (read from the SMTP sink) opens the editor on
// that bead with the thread open; the supervisor resolves it and the modeller's badge goes, live.
// Payloads in the comment, the bead name and the modeller's display name must stay inert text.

const PASSWORD = 'beadloom-demo';
/** Live changes must reach other viewers within 2 s (a wait's time-out, not a measurement). */
const LIVE = 2_000;
const BEAD_NAME = '<img src=x onerror=window.__xss=1>';
const DISPLAY_NAME = 'Tomas <b onmouseover="window.__xss=2">Brenn</b>';
const BODY_PAYLOADS = ' <script>window.__xss=3</script> <img src=x onerror="window.__xss=4"> [click me](javascript:window.__xss=5) **bold**';

const session = browserSession();
const pageErrors = session.errors;
const signedIn = (email: string): Promise<Page> => session.signedIn(email, PASSWORD);

const xss = (page: Page) => page.evaluate(() => (window as unknown as { __xss?: number }).__xss ?? null);

beforeAll(() => session.open());
afterAll(() => session.close());

describe('threads on beads', () => {
  it('mention → live bell → e-mail link → thread open → resolve → badge gone live', async () => {
    const modeller = await signedIn('modeller@example.org');
    const supervisor = await signedIn('supervisor@example.org');

    // The modeller's display name carries HTML (set through the real API).
    const mappingId = await modeller.evaluate(async (name) => {
      const { token } = await (await fetch('/api/auth/csrf')).json();
      await fetch('/api/me', { method: 'PATCH', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify({ displayName: name }) });
      const projects = await (await fetch('/api/projects')).json();
      const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
      const mappings = await (await fetch(`/api/molecules/${molecules[0].id}/mappings`)).json();
      return mappings[0].id as number;
    }, DISPLAY_NAME);

    await modeller.goto(`/mappings/${mappingId}`);
    await modeller.locator('[data-connection="live"]').waitFor();
    // Rename the first bead to an HTML payload, through the editor.
    const firstRow = modeller.getByRole('table', { name: 'Beads' }).getByRole('row').nth(1);
    await firstRow.click();
    const nameField = modeller.getByLabel('Bead name');
    await nameField.fill(BEAD_NAME);
    await nameField.press('Enter');
    const row = modeller.getByRole('row', { name: `Bead ${BEAD_NAME}` });
    await row.waitFor();

    // Start a thread on it, mentioning the supervisor through the @ autocomplete.
    await row.getByRole('button', { name: `Start a thread on bead ${BEAD_NAME}` }).click();
    const panel = modeller.getByRole('region', { name: `Threads on bead ${BEAD_NAME}` });
    const box = panel.getByLabel('Start a new thread');
    await box.click();
    await box.pressSequentially('Is this right, @Ine');
    await modeller.getByRole('option', { name: /Dr Ines Marlow/ }).waitFor();
    await box.press('Enter');
    // The box shows the name, not the raw token; a chip says who is mentioned (issue 13, point 14).
    expect(await box.inputValue()).toBe('Is this right, @Dr Ines Marlow ');
    await panel.getByRole('list', { name: 'Mentioned' }).getByText('@Dr Ines Marlow').waitFor();
    await box.pressSequentially(`?${BODY_PAYLOADS}`);
    await panel.getByRole('button', { name: 'Start thread' }).click();
    // The supervisor, on the projects page, sees the bell count arrive without reloading.
    await supervisor.getByRole('button', { name: 'Notifications, 1 unread' }).waitFor({ timeout: LIVE });
    const thread = panel.getByRole('listitem', { name: 'Open thread' });
    await thread.locator('.mention', { hasText: '@Dr Ines Marlow' }).waitFor();
    const threadId = Number(await thread.getAttribute('data-thread'));
    expect(threadId).toBeGreaterThan(0);

    // The badge with the open-thread count appears on the drawing and in the table.
    const drawingBadge = modeller.locator('svg[role="application"] [data-thread-badge]');
    await drawingBadge.first().waitFor();
    const id = (await drawingBadge.first().getAttribute('data-thread-badge'))!;
    await expect(modeller.locator(`svg [data-thread-badge="${id}"]`).textContent()).resolves.toBe('1');
    await row.getByRole('button', { name: `1 open thread on bead ${BEAD_NAME}` }).waitFor();
    await modeller.getByRole('region', { name: 'Bead graph' }).getByRole('button', { name: `1 open thread on bead ${BEAD_NAME}` }).waitFor();

    await supervisor.getByRole('button', { name: 'Notifications, 1 unread' }).click();
    await supervisor.getByRole('link', { name: `Unread: ${DISPLAY_NAME} mentioned you in ${await mappingName(supervisor, mappingId)}` }).waitFor();

    // The e-mail, from the SMTP sink: recipient, subject and the deep link.
    // Read as the site admin: only an admin may read the caught mail.
    // Mail goes out after the answer (a job), so wait until the sink holds it rather than reading once.
    const mentionMail = async () => (await session.mail()).find((m) => String(m.to).includes('supervisor@example.org') && m.subject.includes('mentioned you'));
    await expect.poll(async () => (await mentionMail()) !== undefined, { timeout: 15_000 }).toBe(true);
    const mention = (await mentionMail())!;
    expect(mention.subject).toBe(`Tomas <b onmouseover="window.__xss=2">Brenn</b> mentioned you on ${BEAD_NAME}`);
    const link = /Open the thread: (\S+)/.exec(mention.text)![1]!;
    expect(link).toBe(`${session.url}/mappings/${mappingId}?bead=${id}&thread=${threadId}`);

    // The link opens the editor with that bead selected and the thread open.
    await supervisor.goto(link);
    const supPanel = supervisor.getByRole('region', { name: `Threads on bead ${BEAD_NAME}` });
    const supThread = supPanel.getByRole('listitem', { name: 'Open thread' });
    await supThread.getByText('Is this right,').waitFor();
    await supervisor.getByRole('region', { name: `Bead ${BEAD_NAME}`, exact: true }).waitFor();
    await expect(supervisor.getByLabel('Bead name').inputValue()).resolves.toBe(BEAD_NAME);

    // Everything hostile is text: no script ran, no element came from the payloads.
    const body = supThread.locator('.comment-body');
    await expect(body.locator('script, img, b, a[href^="javascript"]').count()).resolves.toBe(0);
    await expect(body.locator('strong').textContent()).resolves.toBe('bold');
    await expect(body.textContent()).resolves.toContain('<script>window.__xss=3</script>');
    await expect(supThread.getByText(DISPLAY_NAME).count()).resolves.toBeGreaterThan(0);
    await supThread.getByText(DISPLAY_NAME).first().hover();
    for (const page of [modeller, supervisor]) expect(await xss(page)).toBeNull();

    // A reply from the modeller reaches the supervisor's open thread live.
    await thread.getByLabel('Reply').fill('Moved the carbon; have a look.');
    await thread.getByRole('button', { name: 'Reply' }).click();
    await supThread.getByText('Moved the carbon; have a look.').waitFor({ timeout: LIVE });

    // The supervisor resolves it; the modeller's badges go away live.
    await supThread.getByRole('button', { name: 'Resolve' }).click();
    await supThread.getByText('Resolved by Dr Ines Marlow').waitFor();
    await modeller.locator(`svg [data-thread-badge="${id}"]`).waitFor({ state: 'detached', timeout: LIVE });
    await expect(modeller.getByRole('region', { name: 'Bead graph' }).locator('[data-thread-badge]').count()).resolves.toBe(0);
    await row.getByRole('button', { name: `Start a thread on bead ${BEAD_NAME}` }).waitFor({ timeout: LIVE });
    await panel.getByRole('listitem', { name: 'Open thread' }).getByText(/^Resolved/).waitFor();

    // A saved version lists the threads of the beads it contains.
    await supervisor.getByLabel('Version message').fill('After the ring discussion.');
    await supervisor.getByRole('button', { name: 'Save version' }).click();
    await supervisor.getByRole('list', { name: 'Versions' }).getByRole('listitem', { name: 'Version 1' }).getByRole('button', { name: 'View' }).click();
    const versionThreads = supervisor.getByRole('region', { name: 'Threads on the beads of version 1' });
    await versionThreads.getByRole('link', { name: new RegExp(`Resolved.*Is this right`) }).waitFor();
    await expect(versionThreads.getByText(BEAD_NAME).count()).resolves.toBe(1);
    for (const page of [modeller, supervisor]) expect(await xss(page)).toBeNull();

    expect(pageErrors).toEqual([]);
  });
});

async function mappingName(page: Page, mappingId: number): Promise<string> {
  return page.evaluate(async (id) => (await (await fetch(`/api/mappings/${id}`)).json()).name as string, mappingId);
}
