// The append-only audit trail of a mapping: every save, restore, lock, unlock and import, with who, when,
// which version and why. Read with GET /api/mappings/:id/audit, newest first.

export const AUDIT_ACTIONS = ['save', 'restore', 'lock', 'unlock', 'import'] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export interface AuditEntry {
  id: number;
  action: AuditAction;
  actor: { id: number; displayName: string } | null;
  /** The version saved, restored or locked; for an unlock, the version that was production. */
  version: number | null;
  /** The save's message, the lock's note, the unlock's reason or what was imported ('' when none). */
  reason: string;
  at: string;
}
