import request from 'supertest';
import type { Express } from 'express';
import { DEMO_PASSWORD } from '../../seeds/demo-data';

// A signed-in (or anonymous) API client over supertest: keeps cookies, fetches
// the CSRF token and sends it on every state-changing request.

export class ApiClient {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  async fetchCsrf(): Promise<string> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.csrf = res.body.token;
    return this.csrf;
  }

  async signIn(email: string, password = DEMO_PASSWORD) {
    if (!this.csrf) await this.fetchCsrf();
    const res = await this.post('/api/auth/login', { email, password });
    if (res.status === 200) this.csrf = res.body.csrfToken;
    return res;
  }

  get = (path: string) => this.agent.get(path);
  post = (path: string, body?: unknown) => this.agent.post(path).set('x-csrf-token', this.csrf).send(body as object);
  put = (path: string, body?: unknown) => this.agent.put(path).set('x-csrf-token', this.csrf).send(body as object);
  patch = (path: string, body?: unknown) => this.agent.patch(path).set('x-csrf-token', this.csrf).send(body as object);
  delete = (path: string) => this.agent.delete(path).set('x-csrf-token', this.csrf);
}

export async function signedIn(app: Express, email: string, password?: string): Promise<ApiClient> {
  const client = new ApiClient(app);
  const res = await client.signIn(email, password);
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}

export async function anonymous(app: Express): Promise<ApiClient> {
  const client = new ApiClient(app);
  await client.fetchCsrf();
  return client;
}
