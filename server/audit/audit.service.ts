import type { Knex } from 'knex';
import type { Db } from '../db/knex';
import type { AuditAction, AuditEntry } from '../../src/shared/audit';

// Knex for the append-only `mapping_audit`. There is deliberately no update or delete here; the
// table's triggers refuse both (migrations/20261204_033_mapping_audit.ts).

export interface NewAuditEntry {
  mappingId: number;
  action: AuditAction;
  actorId: number;
  version: number | null;
  reason?: string;
}

export async function appendAudit(db: Db | Knex.Transaction, e: NewAuditEntry): Promise<void> {
  await db('mapping_audit').insert({ mapping_id: e.mappingId, action: e.action, actor_id: e.actorId, version_number: e.version, reason: e.reason ?? '' });
}

export async function listAudit(db: Db, mappingId: number): Promise<AuditEntry[]> {
  const rows = await db('mapping_audit as a')
    .leftJoin('users as u', 'u.id', 'a.actor_id')
    .where('a.mapping_id', mappingId)
    .orderBy('a.id', 'desc')
    .select('a.id', 'a.action', 'a.actor_id', 'u.display_name', 'a.version_number', 'a.reason', 'a.created_at');
  return rows.map((r) => ({
    id: Number(r.id),
    action: r.action,
    actor: r.actor_id ? { id: r.actor_id, displayName: r.display_name } : null,
    version: r.version_number ?? null,
    reason: r.reason,
    at: new Date(r.created_at).toISOString(),
  }));
}
