import type { Connection, ExecuteValues, QueryError, ResultSetHeader } from 'mysql2';
import type { Db } from '../db/knex';
import type { NewUpdate } from './draft-store';

/**
 * The live-collaboration write path: accepted Yjs updates appended to mapping_updates through one
 * connection of the collab server's own (made by knex's client, so with the same settings), outside
 * the pool and the query builder. An accepted update waits for this INSERT before it is relayed, and
 * knex's per-query work (pool acquire, query compile, promise layers) was a large share of that wait
 * (docs/benchmarks.md). Each append is one autocommitted prepared statement; appends from all rooms
 * queue in order on the connection. A lost connection is replaced, and that append retried once (a
 * repeated Yjs update is harmless: applying it twice changes nothing).
 */
export class UpdateLog {
  private conn: Promise<Connection> | null = null;
  /** The connection `conn` resolved to, once it has. */
  private live: Connection | null = null;
  private closed = false;

  constructor(private readonly db: Db) {}

  /** Appends updates in order; returns the id of the last one (the others come just before it). */
  async append(mappingId: number, updates: NewUpdate[]): Promise<number> {
    // A prepared statement (one per batch size, kept by mysql2 for the connection): the update goes
    // as binary, not as an escaped literal MariaDB would parse.
    const sql = `INSERT INTO mapping_updates (mapping_id, user_id, data) VALUES ${updates.map(() => '(?, ?, ?)').join(', ')}`;
    const result = await this.run(sql, updates.flatMap((u) => [mappingId, u.userId, Buffer.from(u.data)]));
    // One multi-row INSERT: InnoDB gives its rows consecutive ids (innodb_autoinc_lock_mode ≤ 1 for
    // simple inserts, and MariaDB's default is 1), and insertId is the first of them.
    return Number(result.insertId) + updates.length - 1;
  }

  async close(): Promise<void> {
    this.closed = true;
    const pending = this.conn;
    this.conn = null;
    this.live = null;
    const conn = await pending?.catch(() => null);
    if (conn) await (this.db.client as RawClient).destroyRawConnection(conn);
  }

  /** One prepared statement; on a lost connection, once more on a new one. */
  private async run(sql: string, values: ExecuteValues[]): Promise<ResultSetHeader> {
    try {
      return await this.once(sql, values);
    } catch (err) {
      if (!(err as { fatal?: boolean }).fatal || this.closed) throw err;
      return this.once(sql, values);
    }
  }

  private async once(sql: string, values: ExecuteValues[]): Promise<ResultSetHeader> {
    const conn = await this.connection();
    return new Promise((resolve, reject) => {
      const done = (err: QueryError | null, res: ResultSetHeader) => {
        if (err) {
          if (err.fatal) this.drop(conn);
          reject(err);
        } else resolve(res);
      };
      conn.execute<ResultSetHeader>(sql, values, done);
    });
  }

  private connection(): Promise<Connection> {
    if (this.closed) return Promise.reject(new Error('The update log is closed.'));
    if (!this.conn) {
      const pending = (this.db.client as RawClient).acquireRawConnection();
      this.conn = pending;
      pending.then(
        (conn) => {
          if (this.conn === pending) this.live = conn;
          conn.on('error', () => this.drop(conn));
          conn.on('end', () => this.drop(conn));
          // The server's listener keeps the process alive; this socket alone must not (tests, scripts).
          (conn as unknown as { stream?: { unref?(): void } }).stream?.unref?.();
        },
        () => {
          if (this.conn === pending) this.conn = null;
        },
      );
    }
    return this.conn;
  }

  /** Forgets a broken connection so the next append opens a new one. */
  private drop(conn: Connection): void {
    if (this.live !== conn) return;
    this.live = null;
    this.conn = null;
  }
}

interface RawClient {
  acquireRawConnection(): Promise<Connection>;
  destroyRawConnection(conn: Connection): Promise<void>;
}
