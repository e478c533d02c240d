import { request, type IncomingHttpHeaders } from 'node:http';

// An HTTP client that connects from a chosen loopback address (Linux routes all of 127.0.0.0/8 to
// lo), so tests can be "another address" for real, without a proxy header the server may not trust.
// Keeps its cookies and the CSRF token like helpers/client.ts.

export interface AddressResponse {
  status: number;
  headers: IncomingHttpHeaders;
  body: any;
}

export class AddressClient {
  private readonly cookies = new Map<string, string>();
  csrf = '';

  constructor(
    private readonly baseUrl: string,
    readonly localAddress: string,
  ) {}

  send(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<AddressResponse> {
    const url = new URL(path, this.baseUrl);
    const payload = body === undefined ? undefined : Buffer.from(JSON.stringify(body));
    return new Promise((resolve, reject) => {
      const req = request(
        url,
        {
          method,
          localAddress: this.localAddress,
          headers: {
            ...(payload ? { 'content-type': 'application/json', 'content-length': String(payload.length) } : {}),
            ...(this.csrf ? { 'x-csrf-token': this.csrf } : {}),
            cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
            ...headers,
          },
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => {
            for (const line of res.headers['set-cookie'] ?? []) {
              const [pair] = line.split(';');
              const eq = pair.indexOf('=');
              this.cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
            }
            const text = Buffer.concat(chunks).toString('utf8');
            resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text && /json/.test(String(res.headers['content-type'])) ? JSON.parse(text) : text });
          });
        },
      );
      req.on('error', reject);
      req.end(payload);
    });
  }

  async signIn(email: string, password: string, headers: Record<string, string> = {}): Promise<AddressResponse> {
    if (!this.csrf) this.csrf = (await this.send('GET', '/api/auth/csrf', undefined, headers)).body.token;
    const res = await this.send('POST', '/api/auth/login', { email, password }, headers);
    if (res.status === 200) this.csrf = res.body.csrfToken;
    return res;
  }
}
