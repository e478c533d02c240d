import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.stop());

describe('GET /api/health', () => {
  it('answers ok with the database up', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });

  it('answers 404 in the shared error shape for an unknown API route', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('not_found');
    expect(typeof res.body.error.message).toBe('string');
  });
});
