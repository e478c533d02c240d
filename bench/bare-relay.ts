// The reference for bench/collab.ts: a bare Yjs relay on y-protocols — sync and awareness only, one
// in-memory document per path, no authentication, validation, persistence or evaluation.
// Run as its own process; prints "READY <port>".
import { createServer } from 'node:http';
import { WebSocketServer, type WebSocket } from 'ws';
import * as Y from 'yjs';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import * as sync from 'y-protocols/sync';

const docs = new Map<string, { doc: Y.Doc; conns: Set<WebSocket> }>();
const server = createServer();
const wss = new WebSocketServer({ server });
wss.on('connection', (ws, req) => {
  const name = req.url ?? '/';
  let room = docs.get(name);
  if (!room) docs.set(name, (room = { doc: new Y.Doc(), conns: new Set() }));
  const { doc, conns } = room;
  conns.add(ws);
  const e0 = encoding.createEncoder();
  encoding.writeVarUint(e0, 0);
  sync.writeSyncStep1(e0, doc);
  ws.send(encoding.toUint8Array(e0));
  ws.on('message', (data: Buffer) => {
    const d = decoding.createDecoder(new Uint8Array(data));
    const type = decoding.readVarUint(d);
    if (type === 1) {
      for (const c of conns) c.send(data);
      return;
    }
    if (type !== 0) return;
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, 0);
    const sub = sync.readSyncMessage(d, e, doc, ws);
    if (sub === sync.messageYjsSyncStep1) ws.send(encoding.toUint8Array(e));
  });
  ws.on('close', () => conns.delete(ws));
  doc.on('update', (update: Uint8Array, origin: unknown) => {
    if (origin !== ws) return;
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, 0);
    sync.writeUpdate(e, update);
    const frame = encoding.toUint8Array(e);
    for (const c of conns) if (c !== ws) c.send(frame);
  });
});
server.listen(0, '127.0.0.1', () => {
  const a = server.address();
  process.stdout.write(`READY ${typeof a === 'object' && a ? a.port : 0}\n`);
});
