import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { anonymous, signedIn, type ApiClient } from '../helpers/client';
import { createAccount } from '../helpers/fixtures';
import { caseEnv, ROLES, ROUTE_CASES, type CaseEnv, type Caller } from './permission-table';

// Walks every route of the app × every kind of caller and checks the status.

let t: TestApp;
let env: CaseEnv;
const clients = new Map<Caller, ApiClient>();
const EMAIL: Record<Exclude<Caller, 'anonymous'>, string> = {
  nonMember: 'outsider@example.org',
  student: 'student@example.org',
  modeller: 'modeller@example.org',
  supervisor: 'supervisor@example.org',
  admin: 'admin@example.org',
};

async function clientFor(caller: Caller): Promise<ApiClient> {
  return caller === 'anonymous' ? anonymous(t.app) : signedIn(t.app, EMAIL[caller]);
}

beforeAll(async () => {
  // Generous sign-in limits: this test signs in many times from one address.
  t = await createTestApp({ loginLimits: { perAccount: 1000, perIp: 10_000, windowMs: 60_000 } });
  await createAccount(t.ctx.db, EMAIL.nonMember);
  env = await caseEnv(t.ctx.db);
  for (const role of ROLES) clients.set(role, await clientFor(role));
});
afterAll(() => t.stop());

describe('route × role permissions', () => {
  it('has a row for every route the app serves, and no row for a route it does not', () => {
    const served = t.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`).sort();
    const table = ROUTE_CASES.map((c) => `${c.method.toUpperCase()} ${c.path}`).sort();
    expect(table).toEqual(served);
  });

  for (const row of ROUTE_CASES) {
    it(`${row.method.toUpperCase()} ${row.path}`, async () => {
      const got: Partial<Record<Caller, number>> = {};
      for (const caller of ROLES) {
        const client = row.fresh ? await clientFor(caller) : clients.get(caller)!;
        const { url, body } = await row.request(env, caller);
        const res = await client[row.method](url, ...(body === undefined ? [] : [body]));
        got[caller] = res.status;
        if (res.status >= 400) expect(res.body.error?.code, `${caller}: error shape`).toEqual(expect.any(String));
      }
      expect(got).toEqual(row.expect);
    });
  }
});
