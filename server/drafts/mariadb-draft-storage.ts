import type { Db } from '../db/knex';
import { connectionOptions } from '../db/knex';
import type { DraftStorage } from './draft-storage';
import { UpdateLog } from './update-log';
import { foldSnapshot, loadDraft, touchMapping, writeSnapshot } from './drafts.service';

/**
 * Drafts in MariaDB (drafts.service.ts): appends go through the update log's own connection
 * (update-log.ts), everything else through the app's pool. `shared`: other servers hold the same
 * mappings (REDIS_URL), so compaction folds what is stored too (foldSnapshot).
 */
export function createMariaDbDraftStorage(db: Db, databaseUrl: string, shared = false): DraftStorage {
  const log = new UpdateLog(connectionOptions(databaseUrl));
  return {
    load: (mappingId, atomCount) => loadDraft(db, mappingId, atomCount),
    append: (mappingId, updates) => log.append(mappingId, updates),
    compact: (mappingId, state, upTo) => (shared ? foldSnapshot : writeSnapshot)(db, mappingId, state, upTo),
    touch: (mappingId, beadCount) => touchMapping(db, mappingId, beadCount),
    close: () => log.close(),
  };
}

