import { createServer, type Server } from 'node:http';
import WebSocket from 'ws';
import * as Y from 'yjs';
import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import { messageYjsUpdate } from 'y-protocols/sync';
import { WebsocketProvider } from 'y-websocket';
import { MESSAGE_AWARENESS, MESSAGE_ERROR, MESSAGE_EVALUATION, MESSAGE_SESSION, MESSAGE_SYNC, type CollabErrorMessage, type EvaluationMessage, type SessionMessage } from '../../src/shared/collab-protocol';
import { DEMO_PASSWORD } from '../../seeds/demo-data';
import type { TestApp } from './test-app';

// Real y-websocket clients in Node for the collab tests and the benchmark: a `ws` subclass that sends
// the session cookie, and `disableBc: true` (Node's global BroadcastChannel would otherwise let
// same-process clients sync around the server).

/** Signs in over HTTP: the Cookie header value for the session, and its CSRF token. */
export async function signInOverHttp(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<{ cookie: string; csrfToken: string }> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
  const csrfCookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const { token } = (await csrf.json()) as { token: string };
  const login = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: csrfCookie, 'x-csrf-token': token },
    body: JSON.stringify({ email, password }),
  });
  if (login.status !== 200) throw new Error(`sign-in as ${email} failed: ${login.status}`);
  const { csrfToken } = (await login.json()) as { csrfToken: string };
  return { cookie: login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; '), csrfToken };
}

/** Signs in over HTTP and returns the Cookie header value for the session. */
export async function sessionCookie(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  return (await signInOverHttp(baseUrl, email, password)).cookie;
}

export function cookieSocket(cookie: string): unknown {
  return class CookieWebSocket extends WebSocket {
    constructor(address: string | URL, protocols?: string | string[]) {
      super(address, protocols, { headers: { cookie } });
    }
  };
}

export interface CollabClient {
  doc: Y.Doc;
  provider: WebsocketProvider;
  evaluations: EvaluationMessage[];
  errors: CollabErrorMessage[];
  session: SessionMessage | null;
  /** Close codes of the server's closes, in order. */
  closes: number[];
  destroy(): void;
}

const readJson = <T>(decoder: decoding.Decoder) => JSON.parse(decoding.readVarString(decoder)) as T;

export function connectClient(baseUrl: string, mappingId: number, cookie: string, doc = new Y.Doc()): CollabClient {
  const provider = new WebsocketProvider(`${baseUrl.replace(/^http/, 'ws')}/collab`, String(mappingId), doc, {
    WebSocketPolyfill: cookieSocket(cookie) as never,
    disableBc: true,
  });
  const client: CollabClient = { doc, provider, evaluations: [], errors: [], session: null, closes: [], destroy: () => (provider.destroy(), doc.destroy()) };
  provider.on('connection-close', (event) => void (event && client.closes.push(event.code)));
  provider.messageHandlers[MESSAGE_EVALUATION] = (_e, d) => void client.evaluations.push(readJson(d));
  provider.messageHandlers[MESSAGE_ERROR] = (_e, d) => void client.errors.push(readJson(d));
  provider.messageHandlers[MESSAGE_SESSION] = (_e, d) => void (client.session = readJson(d));
  return client;
}

/** Polls until `check` holds; throws with `what` after `ms` (a bound for a broken run, not a speed test). */
export async function until(what: string, check: () => boolean | Promise<boolean>, ms = 15_000): Promise<void> {
  const deadline = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for: ${what}`);
    await new Promise((r) => setTimeout(r, 10));
  }
}

export const synced = (c: CollabClient) => until('sync', () => c.provider.synced && c.session !== null);

/** The test app on a real HTTP server with the collab upgrade attached. */
export async function listen(t: TestApp): Promise<{ server: Server; url: string; close(): Promise<void> }> {
  const server = createServer(t.app);
  server.on('upgrade', t.collab.handleUpgrade);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const url = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
  return {
    server,
    url,
    close: async () => {
      await t.collab.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * A bare socket on /collab/:id that sends hand-made frames, as an attacker's client would: the
 * server's error messages and the close code are collected.
 */
export interface RawCollabSocket {
  ws: WebSocket;
  errors: CollabErrorMessage[];
  /** Resolves with the close code once the socket closed. */
  closed: Promise<number>;
  sendUpdate(update: Uint8Array): void;
  sendAwareness(update: Uint8Array): void;
}

export async function rawCollabSocket(baseUrl: string, mappingId: number, cookie: string): Promise<RawCollabSocket> {
  const ws = new WebSocket(`${baseUrl.replace(/^http/, 'ws')}/collab/${mappingId}`, { headers: { cookie } });
  const errors: CollabErrorMessage[] = [];
  const closed = new Promise<number>((resolve) => ws.on('close', (code) => resolve(code)));
  ws.on('error', () => undefined);
  ws.on('message', (data: Buffer) => {
    const d = decoding.createDecoder(new Uint8Array(data));
    if (decoding.readVarUint(d) === MESSAGE_ERROR) errors.push(readJson(d));
  });
  await new Promise((resolve, reject) => (ws.once('open', resolve), ws.once('unexpected-response', (_q, res) => reject(new Error(`upgrade answered ${res.statusCode}`)))));
  const frame = (type: number, write: (e: encoding.Encoder) => void) => {
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, type);
    write(e);
    ws.send(encoding.toUint8Array(e));
  };
  return {
    ws,
    errors,
    closed,
    sendUpdate: (update) => frame(MESSAGE_SYNC, (e) => (encoding.writeVarUint(e, messageYjsUpdate), encoding.writeVarUint8Array(e, update))),
    sendAwareness: (update) => frame(MESSAGE_AWARENESS, (e) => encoding.writeVarUint8Array(e, update)),
  };
}
