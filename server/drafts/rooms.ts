import { DraftRoom, type RoomDeps } from './draft-room';

// The live rooms of this server, by mapping id. A room opens (loads from storage) on the first
// connection and closes once its last peer left and the draft was compacted.

export class Rooms {
  private readonly rooms = new Map<number, Promise<DraftRoom | null>>();

  constructor(private readonly deps: RoomDeps) {}

  open(mappingId: number): Promise<DraftRoom | null> {
    let room = this.rooms.get(mappingId);
    if (!room) {
      room = DraftRoom.open(this.deps, mappingId).then((r) => {
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
  async live(mappingId: number): Promise<DraftRoom | null> {
    const room = await this.rooms.get(mappingId)?.catch(() => null);
    return room && !room.closed ? room : null;
  }

  async all(): Promise<DraftRoom[]> {
    const rooms = await Promise.all([...this.rooms.values()].map((r) => r.catch(() => null)));
    return rooms.filter((r): r is DraftRoom => !!r && !r.closed);
  }

  /** Waits for queued work (storage, compaction), closes every room, then storage and relay. */
  async closeAll(): Promise<void> {
    for (const room of await this.all()) await room.shutdown();
    this.rooms.clear();
    await this.deps.storage.close();
    await this.deps.relay.close();
  }
}
