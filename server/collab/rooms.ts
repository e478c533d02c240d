import type { AppContext } from '../context';
import { Room, type CollabOptions } from './room';
import { UpdateLog } from './update-log';

// The live rooms of this server, by mapping id. A room opens (loads from MariaDB) on the first
// connection and closes once its last peer left and the draft was compacted.

export class Rooms {
  private readonly rooms = new Map<number, Promise<Room | null>>();
  /** Every room's accepted updates go to MariaDB through this one connection. */
  private readonly log: UpdateLog;

  constructor(
    private readonly ctx: AppContext,
    private readonly opts: CollabOptions,
  ) {
    this.log = new UpdateLog(ctx.db);
  }

  open(mappingId: number): Promise<Room | null> {
    let room = this.rooms.get(mappingId);
    if (!room) {
      room = Room.open(this.ctx, this.log, mappingId, this.opts).then((r) => {
        if (!r) this.rooms.delete(mappingId);
        else
          r.onEmptied = () => {
            r.close();
            if (this.rooms.get(mappingId) === room) this.rooms.delete(mappingId);
          };
        return r;
      });
      room.catch(() => this.rooms.delete(mappingId));
      this.rooms.set(mappingId, room);
    }
    return room;
  }

  /** The room if it is open right now. */
  async live(mappingId: number): Promise<Room | null> {
    const room = await this.rooms.get(mappingId)?.catch(() => null);
    return room && !room.closed ? room : null;
  }

  async all(): Promise<Room[]> {
    const rooms = await Promise.all([...this.rooms.values()].map((r) => r.catch(() => null)));
    return rooms.filter((r): r is Room => !!r && !r.closed);
  }

  /** Waits for queued work (persistence, compaction), closes every room and the update log. */
  async closeAll(): Promise<void> {
    for (const room of await this.all()) await room.shutdown();
    this.rooms.clear();
    await this.log.close();
  }
}
