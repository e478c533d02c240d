import type { Knex } from 'knex';

/**
 * Tells when writes through a knex instance begin and when they are committed, so a cache of answers
 * built from MariaDB (read-cache.ts) can drop them. knex reports every statement it runs ('query'
 * event, with the connection's id) but not a transaction's COMMIT; a transaction's connection goes
 * back to the pool only after its COMMIT or ROLLBACK was answered, and a single statement's after its
 * answer. So: a statement that is not a read marks its connection; when a marked connection is
 * released, the write is visible to every later read (`committed`). `open()` says whether a write
 * has begun and is not yet committed — a read finishing meanwhile may hold the old state or, inside
 * nothing, a half-done one, and must not be kept.
 */
export interface WriteWatch {
  open(): boolean;
  stop(): void;
}

/** Statements that change nothing. Anything else (INSERT, UPDATE, DELETE, REPLACE, DDL, CALL …) counts as a write. */
const READ_ONLY = /^\s*\(?\s*(select|show|explain|describe|desc)\b/i;

export function watchWrites(db: Knex, on: { started(): void; committed(): void }): WriteWatch {
  const marked = new Set<string>();
  const onQuery = (q: { sql?: string; __knexUid?: string }) => {
    if (typeof q.sql === 'string' && READ_ONLY.test(q.sql)) return;
    // Without a connection id (never seen in knex 3) the write can only be seen to begin: stay closed for good rather than miss its end.
    marked.add(q.__knexUid ?? 'unknown');
    on.started();
  };
  db.on('query', onQuery);
  const client = db.client as { releaseConnection(connection: { __knexUid?: string }): Promise<void> };
  const release = client.releaseConnection;
  let watching = true;
  const releaseWatched = function (this: unknown, connection: { __knexUid?: string }) {
    const done = release.call(this, connection);
    if (watching && connection?.__knexUid !== undefined && marked.delete(connection.__knexUid)) on.committed();
    return done;
  };
  client.releaseConnection = releaseWatched;
  return {
    open: () => marked.size > 0,
    stop() {
      watching = false;
      db.off('query', onQuery);
      // Another watch may have wrapped it since: then ours stays in the chain, passing through.
      if (client.releaseConnection === releaseWatched) client.releaseConnection = release;
      marked.clear();
    },
  };
}
