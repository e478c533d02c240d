import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { brotliCompressSync, deflateSync, gzipSync } from 'node:zlib';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId, snapshot } from '../helpers/fixtures';

// Issue 11, item 7: bodies the server cannot read are the client's mistake — 400 (or 415 for an
// encoding it does not support), never 500 — in the shared shape, and change nothing.

let t: TestApp;
let supervisor: ApiClient;
let projectId: number;
beforeAll(async () => {
  t = await createTestApp();
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  projectId = await demoProjectId(t.ctx.db);
});
afterAll(() => t.stop());

async function expectRefused(send: () => PromiseLike<{ status: number; body: any }>, status: number, code: string) {
  const before = await snapshot(t.ctx.db);
  const res = await send();
  expect(res.status).toBe(status);
  expect(res.body.error).toEqual(expect.objectContaining({ code, message: expect.any(String) }));
  expect(await snapshot(t.ctx.db)).toEqual(before);
  return res;
}

/** superagent would JSON-encode a Buffer; these bodies must go out byte for byte. */
const asIs = ((b: Buffer) => b) as unknown as (obj: unknown) => string;

const encoded = (encoding: string, body: Buffer) => () =>
  supervisor.agent.post('/api/projects').set('x-csrf-token', supervisor.csrf).set('content-type', 'application/json').set('content-encoding', encoding).serialize(asIs).send(body);

const json = Buffer.from(JSON.stringify({ name: 'Compressed project' }));

describe('Content-Encoding that does not decode', () => {
  for (const encoding of ['gzip', 'deflate', 'br']) {
    it(`${encoding} over bytes that are not ${encoding} → 400 malformed_body`, async () => {
      const res = await expectRefused(encoded(encoding, Buffer.from('{"name": "plain text, not compressed"}')), 400, 'malformed_body');
      expect(res.body.error.message).toContain(encoding);
    });
  }

  it('a truncated gzip stream → 400 malformed_body', async () => {
    await expectRefused(encoded('gzip', gzipSync(json).subarray(0, 12)), 400, 'malformed_body');
  });

  it('an encoding the server does not support → 415', async () => {
    await expectRefused(encoded('zstd', json), 415, 'unsupported_media_type');
  });

  it('well-formed gzip, deflate and br bodies are read as before', async () => {
    for (const [encoding, body] of [
      ['gzip', gzipSync(json)],
      ['deflate', deflateSync(json)],
      ['br', brotliCompressSync(json)],
    ] as const) {
      const res = await encoded(encoding, body)();
      expect(res.status, encoding).toBe(201);
      expect(res.body.name).toBe('Compressed project');
    }
  });
});

describe('malformed multipart uploads', () => {
  const upload = (body: string | Buffer, contentType = 'multipart/form-data; boundary=XyZ') => () =>
    supervisor.agent.post(`/api/projects/${projectId}/molecules/upload`).set('x-csrf-token', supervisor.csrf).set('content-type', contentType).send(Buffer.from(body));

  it('a NUL in a part header → 400 malformed_multipart', async () => {
    const body = '--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.mol"\r\nContent-\u0000Type: text/plain\r\n\r\nabc\r\n--XyZ--\r\n';
    await expectRefused(upload(body), 400, 'malformed_multipart');
  });

  it('a body that ends inside a part → 400 malformed_multipart', async () => {
    await expectRefused(upload('--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.mol"\r\n\r\nabc'), 400, 'malformed_multipart');
  });

  it('a multipart content type without a boundary → 400 malformed_multipart', async () => {
    await expectRefused(upload('--XyZ--\r\n', 'multipart/form-data'), 400, 'malformed_multipart');
  });
});
