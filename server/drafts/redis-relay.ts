import type { RedisLink } from '../cluster/redis-link';
import type { DraftRelay, RelayedMessage } from './draft-relay';
import { createInProcessRelay } from './in-process-relay';

/**
 * The relay between servers (REDIS_URL set), on Redis pub/sub, one channel per mapping
 * (`beadloom:draft:<id>`). `publish` hands the message to this server's rooms at once (as the
 * in-process relay does: the publishing room applies its own update right after) and sends it to the
 * channel; a message that comes back from the channel with this server's name is skipped, the others
 * go to this server's rooms of that mapping in the order Redis delivers them (the same order on every
 * server). Redis delivers at most once, so a room is told `gap` — read the stored draft — when its
 * subscription is confirmed (whatever was stored between its load and that moment) and whenever the
 * subscriber connection comes back after an interruption. Updates are in MariaDB before they are
 * published, so the stored draft always has them.
 *
 * Wire format: 4 bytes (big-endian) header length, the header as JSON (the message without its bytes),
 * then the Yjs or awareness update's bytes (none for an evaluation).
 */
export const draftChannel = (mappingId: number) => `beadloom:draft:${mappingId}`;

export function createRedisRelay(link: RedisLink, onListenerError: (err: unknown) => void): DraftRelay {
  const local = createInProcessRelay(onListenerError);
  const channels = new Map<number, { unsubscribe: () => void; listeners: number }>();
  const gap = (mappingId: number) => local.publish({ kind: 'gap', mappingId });
  const stopResync = link.onResync(() => {
    for (const mappingId of channels.keys()) gap(mappingId);
  });
  return {
    publish(message) {
      local.publish(message);
      if (message.kind !== 'gap') link.publish(draftChannel(message.mappingId), encode(message));
    },
    subscribe(mappingId, listener) {
      const stop = local.subscribe(mappingId, listener);
      let channel = channels.get(mappingId);
      if (!channel) {
        const sub = link.subscribe(draftChannel(mappingId), (raw) => {
          const message = decode(raw);
          if (message.instance !== link.instance) local.publish(message);
        });
        channel = { unsubscribe: sub.unsubscribe, listeners: 0 };
        channels.set(mappingId, channel);
        sub.subscribed.then(() => channels.get(mappingId) === channel && gap(mappingId), onListenerError);
      } else {
        // Already listening: this new subscriber (a room that just loaded) still checks what was stored meanwhile.
        void Promise.resolve().then(() => listener({ kind: 'gap', mappingId }));
      }
      channel.listeners++;
      const held = channel;
      return () => {
        stop();
        if (--held.listeners > 0 || channels.get(mappingId) !== held) return;
        channels.delete(mappingId);
        held.unsubscribe();
      };
    },
    async close() {
      stopResync();
      for (const channel of channels.values()) channel.unsubscribe();
      channels.clear();
      await local.close();
    },
  };
}

type Relayed = Exclude<RelayedMessage, { kind: 'gap' }>;

function encode(message: Relayed): Buffer {
  const bytes = message.kind === 'evaluation' ? new Uint8Array(0) : message.update;
  const header = Buffer.from(JSON.stringify(message.kind === 'evaluation' ? message : { ...message, update: undefined }));
  const out = Buffer.allocUnsafe(4 + header.length + bytes.length);
  out.writeUInt32BE(header.length, 0);
  header.copy(out, 4);
  out.set(bytes, 4 + header.length);
  return out;
}

function decode(raw: Buffer): Relayed {
  const length = raw.readUInt32BE(0);
  const header = JSON.parse(raw.subarray(4, 4 + length).toString()) as Relayed;
  if (header.kind === 'evaluation') return header;
  return { ...header, update: new Uint8Array(raw.subarray(4 + length)) };
}
