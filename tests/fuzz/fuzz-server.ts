import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { request } from 'node:http';
import { createTestDatabase, type TestDatabase } from '../helpers/db';
import { seedDemo } from '../../seeds/demo';

// The server under fuzzing runs as its own process (tests/helpers/server-child.ts), as `npm start`
// runs it: a crash is then an exit we can see, not a dead test worker. `restarts()` counts exits.

export interface FuzzServer {
  url: string;
  database: TestDatabase;
  pid: number;
  /** Times the server process exited while the fuzzer ran (it is never restarted: one exit fails the run). */
  exits(): number;
  stop(): Promise<void>;
}

export async function startFuzzServer(): Promise<FuzzServer> {
  const database = await createTestDatabase();
  await seedDemo(database.db, 12);
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'tests/helpers/server-child.ts'], {
    env: {
      ...process.env,
      DATABASE_URL: database.url,
      SESSION_SECRET: 'fuzz-test-secret-that-is-long-enough-0123456',
      PORT: '0',
      LOG_LEVEL: 'silent',
      CLIENT_DIR: '',
      // The fuzzer signs in again and again from one address; the limiter has its own tests.
      LOGIN_LIMIT_ACCOUNT_ADDRESS: '1000000',
      LOGIN_LIMIT_ACCOUNT: '1000000',
      LOGIN_LIMIT_IP: '1000000',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  let exits = 0;
  child.on('exit', () => exits++);
  let out = '';
  for await (const chunk of child.stdout!) {
    out += chunk;
    const m = /READY (\S+)/.exec(out);
    if (m) {
      child.stdout!.resume();
      return {
        url: m[1].replace('localhost', '127.0.0.1'),
        database,
        pid: child.pid!,
        exits: () => exits,
        async stop() {
          if (child.exitCode === null) {
            child.kill('SIGTERM');
            await once(child, 'exit');
          }
          await database.drop();
        },
      };
    }
  }
  throw new Error(`the server process exited before it was ready: ${out}`);
}

export interface RawResponse {
  status: number;
  contentType: string;
  body: unknown;
  text: string;
}

/** One request with exactly these bytes and headers. Event streams are cut after their headers. */
export function rawRequest(url: string, method: string, path: string, headers: Record<string, string>, body?: Buffer): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const req = request(new URL(path, url), { method, headers: body ? { ...headers, 'content-length': String(body.length) } : headers }, (res) => {
      const contentType = String(res.headers['content-type'] ?? '');
      const setCookie = res.headers['set-cookie'];
      if (/event-stream/.test(contentType)) {
        res.destroy();
        return resolve({ status: res.statusCode ?? 0, contentType, body: null, text: '' });
      }
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const text = Buffer.concat(chunks).toString('utf8');
        let parsed: unknown = undefined;
        if (/json/.test(contentType)) {
          try {
            parsed = JSON.parse(text);
          } catch {
            parsed = undefined;
          }
        }
        resolve(Object.assign({ status: res.statusCode ?? 0, contentType, body: parsed, text }, setCookie ? { setCookie } : {}));
      });
      res.on('error', reject);
    });
    req.setTimeout(30_000, () => req.destroy(new Error(`${method} ${path}: no answer in 30 s`)));
    req.on('error', reject);
    req.end(body);
  });
}

/** A caller: anonymous (with a CSRF token) or signed in, keeping its cookies. */
export class FuzzCaller {
  cookie = '';
  csrf = '';

  constructor(
    private readonly url: string,
    readonly email: string | null,
  ) {}

  private keep(res: RawResponse & { setCookie?: string[] }): void {
    if (!res.setCookie) return;
    const jar = new Map(this.cookie ? this.cookie.split('; ').map((p) => [p.slice(0, p.indexOf('=')), p.slice(p.indexOf('=') + 1)] as [string, string]) : []);
    for (const line of res.setCookie) {
      const pair = line.split(';')[0];
      jar.set(pair.slice(0, pair.indexOf('=')), pair.slice(pair.indexOf('=') + 1));
    }
    this.cookie = [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  /** Fresh session: CSRF token, then sign-in when this caller has an account. Returns false when sign-in failed. */
  async begin(): Promise<boolean> {
    this.cookie = '';
    const csrf = await rawRequest(this.url, 'GET', '/api/auth/csrf', {});
    this.keep(csrf);
    this.csrf = (csrf.body as { token: string }).token;
    if (!this.email) return true;
    const body = Buffer.from(JSON.stringify({ email: this.email, password: 'beadloom-demo' }));
    const res = await this.send('POST', '/api/auth/login', { 'content-type': 'application/json' }, body);
    if (res.status !== 200) return false;
    this.csrf = (res.body as { csrfToken: string }).csrfToken;
    return true;
  }

  async send(method: string, path: string, headers: Record<string, string>, body?: Buffer): Promise<RawResponse> {
    const res = await rawRequest(this.url, method, path, { ...(this.cookie ? { cookie: this.cookie } : {}), 'x-csrf-token': this.csrf, ...headers }, body);
    this.keep(res);
    // A new token replaces the cookie it is checked against (GET /api/auth/csrf, a sign-in): keep it,
    // as the client does; a refusal for a stale token fetches one, as the client does.
    const token = (res.body as { token?: unknown; csrfToken?: unknown } | undefined) ?? {};
    if (res.status === 200 && typeof token.token === 'string') this.csrf = token.token;
    if (res.status === 200 && typeof token.csrfToken === 'string') this.csrf = token.csrfToken;
    if (res.status === 403 && (res.body as { error?: { code?: string } } | undefined)?.error?.code === 'csrf_invalid') {
      const fresh = await rawRequest(this.url, 'GET', '/api/auth/csrf', this.cookie ? { cookie: this.cookie } : {});
      this.keep(fresh);
      this.csrf = (fresh.body as { token: string }).token;
    }
    return res;
  }
}
