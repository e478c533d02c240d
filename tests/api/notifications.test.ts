import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createAccount, demoMappingId, demoProjectId, snapshot, userId } from '../helpers/fixtures';
import type { NotificationList } from '../../src/shared/notifications';
import { firstBeadId } from './threads-fixtures';

let t: TestApp;
let mappingId: number;
let beadId: string;
let modeller: ApiClient;
let supervisor: ApiClient;
let student: ApiClient;
let ids: Record<'modeller' | 'supervisor' | 'student', number>;
beforeAll(async () => {
  t = await createTestApp();
  mappingId = await demoMappingId(t.ctx.db);
  beadId = await firstBeadId(t.ctx.db, mappingId);
  modeller = await signedIn(t.app, 'modeller@example.org');
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  student = await signedIn(t.app, 'student@example.org');
  ids = {
    modeller: await userId(t.ctx.db, 'modeller@example.org'),
    supervisor: await userId(t.ctx.db, 'supervisor@example.org'),
    student: await userId(t.ctx.db, 'student@example.org'),
  };
});
afterAll(() => t.stop());

const mailTo = async (address: string) => (await t.mail()).filter((m) => m.to.includes(address));
// E-mail goes out after the answer (server/jobs): a test waits for the sink's event (t.nextMail), or
// for the request's jobs to have run (t.jobs.idle()) before it says no mail was sent.
const mailFor = (address: string, subject?: RegExp) => t.nextMail((m) => m.to.includes(address) && (!subject || subject.test(m.subject)));
const bell = async (c: ApiClient) => (await c.get('/api/notifications').expect(200)).body as NotificationList;

describe('mentions and replies notify in the app and by e-mail', () => {
  it('a mention notifies the supervisor with an e-mail holding the deep link', async () => {
    const before = (await mailTo('supervisor@example.org')).length;
    const mailed = mailFor('supervisor@example.org');
    const res = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `Please check, @[whoever](user:${ids.supervisor}).` }).expect(201);
    const thread = res.body;
    // The label is rewritten to the member's own name.
    expect(thread.comments[0].body).toBe(`Please check, @[Dr Ines Marlow](user:${ids.supervisor}).`);

    const list = await bell(supervisor);
    expect(list.unread).toBeGreaterThanOrEqual(1);
    expect(list.items[0]).toMatchObject({ kind: 'mention', threadId: thread.id, beadId, mappingId, actor: { displayName: 'Tomas Brenn' }, readAt: null });
    expect(list.items[0]!.excerpt).toBe('Please check, @Dr Ines Marlow.');

    const mail = await mailed;
    await t.jobs.idle();
    expect(await mailTo('supervisor@example.org')).toHaveLength(before + 1);
    expect(mail.to).toBe('supervisor@example.org');
    expect(mail.subject).toBe(`Tomas Brenn mentioned you on ${thread.beadName}`);
    const link = `${t.ctx.config.appUrl}/mappings/${mappingId}?bead=${beadId}&thread=${thread.id}`;
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(`href="${link.replace('&', '&amp;')}"`);
    // Nobody else was mentioned or takes part yet.
    expect(await mailTo('student@example.org')).toHaveLength(0);
    expect((await bell(modeller)).items.filter((n) => n.threadId === thread.id)).toHaveLength(0);
  });

  it('a reply notifies everyone taking part (not the author), as a reply', async () => {
    const created = await student.post(`/api/mappings/${mappingId}/threads`, { beadId, body: 'Question from the student.' }).expect(201);
    const mailed = mailFor('student@example.org', /^New reply on /);
    await modeller.post(`/api/threads/${created.body.id}/comments`, { body: 'Answer.' }).expect(201);
    const studentBell = await bell(student);
    expect(studentBell.items[0]).toMatchObject({ kind: 'reply', threadId: created.body.id, actor: { displayName: 'Tomas Brenn' } });
    expect((await mailed).text).toContain('Answer.');
    await student.post(`/api/threads/${created.body.id}/comments`, { body: 'Thanks!' }).expect(201);
    expect((await bell(modeller)).items[0]).toMatchObject({ kind: 'reply', threadId: created.body.id, actor: { displayName: 'Lea Okafor' } });
    expect((await bell(student)).items[0]!.actor?.displayName).toBe('Tomas Brenn');
  });

  it('mentioning someone outside the project notifies nobody', async () => {
    const outsider = await createAccount(t.ctx.db, 'outsider@example.org', { displayName: 'Out Sider' });
    await t.jobs.idle(); // the earlier tests' e-mail is out before counting
    const before = await snapshot(t.ctx.db, ['notifications']);
    const mailsBefore = (await t.mail()).length;
    const res = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `Hey @[Out Sider](user:${outsider})` }).expect(201);
    expect(res.body.comments[0].body).toBe('Hey @Out Sider');
    await t.jobs.idle();
    expect(await snapshot(t.ctx.db, ['notifications'])).toBe(before);
    expect((await t.mail()).length).toBe(mailsBefore);
  });

  it('marks read: some, then all; only one’s own', async () => {
    const list = await bell(supervisor);
    const first = list.items[0]!;
    const res = await supervisor.post('/api/notifications/read', { ids: [first.id] }).expect(200);
    expect(res.body.unread).toBe(list.unread - 1);
    // The student cannot mark the supervisor's notifications.
    const other = (await bell(student)).items[0]!;
    await supervisor.post('/api/notifications/read', { ids: [other.id] }).expect(200);
    expect((await bell(student)).items[0]!.readAt).toBeNull();
    await supervisor.post('/api/notifications/read', { all: true }).expect(200);
    expect((await bell(supervisor)).unread).toBe(0);
    await supervisor.post('/api/notifications/read', { ids: [] }).expect(400);
    await supervisor.post('/api/notifications/read', { all: false }).expect(400);
  });
});

describe('preferences', () => {
  it('defaults to e-mail on both, and stops e-mail (not the bell) when told', async () => {
    expect((await student.get('/api/me/preferences').expect(200)).body).toEqual({ emailOnMention: true, emailOnReply: true });
    await student.put('/api/me/preferences', { emailOnMention: false, emailOnReply: false }).expect(200);
    const before = (await mailTo('student@example.org')).length;
    const unread = (await bell(student)).unread;
    await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `For @[Lea](user:${ids.student})` }).expect(201);
    await t.jobs.idle();
    expect((await mailTo('student@example.org')).length).toBe(before);
    expect((await bell(student)).unread).toBe(unread + 1);

    await student.put('/api/me/preferences', { emailOnMention: true, emailOnReply: false }).expect(200);
    const mailed = mailFor('student@example.org', /mentioned you/);
    await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `Again @[Lea](user:${ids.student})` }).expect(201);
    await mailed;
    await t.jobs.idle();
    expect((await mailTo('student@example.org')).length).toBe(before + 1);
  });

  it('refuses bad preferences and changes nothing', async () => {
    const before = await snapshot(t.ctx.db, ['notification_preferences']);
    const res = await student.put('/api/me/preferences', { emailOnMention: 'sometimes', emailOnReply: true }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    await student.put('/api/me/preferences', { emailOnMention: true }).expect(400);
    await student.put('/api/me/preferences', { emailOnMention: true, emailOnReply: true, extra: 1 }).expect(400);
    expect(await snapshot(t.ctx.db, ['notification_preferences'])).toBe(before);
  });
});

describe('e-mail header injection through a display name', () => {
  it('a display name with CR/LF reaches no header and adds no recipient', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    await createAccount(t.ctx.db, 'eve@example.org', { displayName: 'Eve', projectId, role: 'modeller' });
    const eve = await signedIn(t.app, 'eve@example.org');
    await eve.patch('/api/me', { displayName: 'Eve\r\nBcc: victim@example.org\r\nSubject: pwned' }).expect(200);
    const before = (await t.mail()).length;
    const mailed = mailFor('supervisor@example.org');
    await eve.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `Hi @[Ines](user:${ids.supervisor}) <b>bold</b>` }).expect(201);
    const mail = await mailed;
    await t.jobs.idle();
    const mails = await t.mail();
    expect(mails.length).toBe(before + 1);
    expect(mail.to).toBe('supervisor@example.org');
    expect(mail.subject).toBe('Eve Bcc: victim@example.org Subject: pwned mentioned you on ' + mail.subject.split(' mentioned you on ')[1]);
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mails.some((m) => m.to.includes('victim@example.org'))).toBe(false);
    expect(mail.html).not.toContain('<b>bold</b>');
    expect(mail.html).toContain('&lt;b&gt;bold&lt;/b&gt;');
  });
});

describe('editing a comment', () => {
  it('notifies only people it newly mentions', async () => {
    const created = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: `Hi @[S](user:${ids.student})` }).expect(201);
    const commentId = created.body.comments[0].id;
    const count = async (userIdValue: number) => Number((await t.ctx.db('notifications').where({ user_id: userIdValue, comment_id: commentId }).count({ n: '*' }).first())!.n);
    expect(await count(ids.student)).toBe(1);
    await modeller.patch(`/api/comments/${commentId}`, { body: `Hi @[S](user:${ids.student}) and @[I](user:${ids.supervisor})` }).expect(200);
    expect(await count(ids.student)).toBe(1);
    expect(await count(ids.supervisor)).toBe(1);
    await modeller.patch(`/api/comments/${commentId}`, { body: `Hi @[S](user:${ids.student}) and @[I](user:${ids.supervisor}), again` }).expect(200);
    expect(await count(ids.supervisor)).toBe(1);
  });
});
