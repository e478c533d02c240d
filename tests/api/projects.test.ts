import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/client';
import { demoProjectId } from '../helpers/fixtures';

let t: TestApp;
let projectId: number;
beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
});
afterAll(() => t.stop());

describe('projects and members', () => {
  it('lists the demo project with its members and molecules for a member', async () => {
    const student = await signedIn(t.app, 'student@example.org');
    const list = await student.get('/api/projects').expect(200);
    expect(list.body).toEqual([expect.objectContaining({ id: projectId, name: 'Micelle formers', role: 'student', memberCount: 3, moleculeCount: 3 })]);
    const members = await student.get(`/api/projects/${projectId}/members`).expect(200);
    expect(members.body.map((m: { role: string }) => m.role).sort()).toEqual(['modeller', 'student', 'supervisor']);
    const molecules = await student.get(`/api/projects/${projectId}/molecules`).expect(200);
    expect(molecules.body).toHaveLength(3);
  });

  it('a supervisor creates a project and becomes its supervisor', async () => {
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const res = await sup.post('/api/projects', { name: 'Bilayer probes', description: 'Second study.' }).expect(201);
    expect(res.body).toMatchObject({ name: 'Bilayer probes', role: 'supervisor', memberCount: 1 });
  });

  it('adds a new person by e-mail: an account, a membership and an invitation e-mail', async () => {
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const res = await sup.post(`/api/projects/${projectId}/members`, { email: 'guest@example.org', role: 'modeller', displayName: 'Guest Modeller' }).expect(201);
    expect(res.body).toMatchObject({ email: 'guest@example.org', role: 'modeller', activated: false });
    const mail = (await t.mail()).find((m) => m.to.includes('guest@example.org'))!;
    expect(mail.subject).toMatch(/set your password/i);
    expect(mail.text).toContain('Micelle formers');
    expect(mail.text).toMatch(/reset-password\?token=/);
  });

  it('changes a role and removes a member; a second supervisor lets the first step down', async () => {
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const members = (await sup.get(`/api/projects/${projectId}/members`)).body as { userId: number; email: string }[];
    const modeller = members.find((m) => m.email === 'modeller@example.org')!;
    const supId = members.find((m) => m.email === 'supervisor@example.org')!.userId;
    await sup.patch(`/api/projects/${projectId}/members/${modeller.userId}`, { role: 'supervisor' }).expect(200);
    await sup.patch(`/api/projects/${projectId}/members/${supId}`, { role: 'modeller' }).expect(200);
    const modSup = await signedIn(t.app, 'modeller@example.org');
    await modSup.patch(`/api/projects/${projectId}/members/${supId}`, { role: 'supervisor' }).expect(200);
    const guest = members.find((m) => m.email === 'guest@example.org');
    if (guest) await sup.delete(`/api/projects/${projectId}/members/${guest.userId}`).expect(204);
  });

  it('renames a project (supervisor)', async () => {
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const res = await sup.patch(`/api/projects/${projectId}`, { description: 'New words.' }).expect(200);
    expect(res.body.description).toBe('New words.');
  });
});
