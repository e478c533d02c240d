import { createConnection, type Connection, type ConnectionOptions, type ExecuteValues, type QueryError, type ResultSetHeader } from 'mysql2';
import type { NewUpdate } from './draft-storage';

/**
 * The live-collaboration write path: accepted Yjs updates appended to mapping_updates through one
 * mysql2 connection of the collab server's own (with the pool's settings, db/knex.ts
 * `connectionOptions`), outside the pool and the query builder. An accepted update waits for this
 * INSERT before it is relayed, and knex's per-query work (pool acquire, query compile, promise layers)
 * was a large share of that wait (docs/benchmarks.md). Each append is one autocommitted prepared
 * statement; appends from all rooms queue in order on the one connection (mysql2 runs a connection's
 * commands one at a time, in the order given). A lost connection is replaced, and that append retried
 * once (a repeated Yjs update is harmless: applying it twice changes nothing).
 */
export class UpdateLog {
  private conn: Connection | null = null;
  private closed = false;

  constructor(private readonly options: ConnectionOptions) {}

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
    const conn = this.conn;
    this.conn = null;
    if (conn) await new Promise<void>((resolve) => conn.end(() => resolve()));
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

  private once(sql: string, values: ExecuteValues[]): Promise<ResultSetHeader> {
    if (this.closed) return Promise.reject(new Error('The update log is closed.'));
    const conn = this.connection();
    return new Promise((resolve, reject) => {
      conn.execute<ResultSetHeader>(sql, values, (err: QueryError | null, res: ResultSetHeader) => {
        if (err) {
          if (err.fatal) this.drop(conn);
          reject(err);
        } else resolve(res);
      });
    });
  }

  /** The connection; mysql2 queues commands given before it has connected. */
  private connection(): Connection {
    if (this.conn) return this.conn;
    const conn = createConnection(this.options);
    conn.on('error', () => this.drop(conn));
    conn.on('end', () => this.drop(conn));
    // The server's listener keeps the process alive; this socket alone must not (tests, scripts).
    (conn as unknown as { stream?: { unref?(): void } }).stream?.unref?.();
    this.conn = conn;
    return conn;
  }

  /** Forgets a broken connection so the next append opens a new one. */
  private drop(conn: Connection): void {
    if (this.conn !== conn) return;
    this.conn = null;
    conn.destroy();
  }
}
