import type { AccessChanges } from './access-changes';
import type { ProjectRole } from '../../src/shared/roles';
import { TtlCache } from '../cache/ttl-cache';

/**
 * What every signed-in request used to read from MariaDB before its own work: the account behind
 * the session (passport.ts) and the caller's role in the project it touches (access.ts). Both are
 * kept here and dropped by the access changes the services already publish after committing
 * (access-changes.ts): an account change (disabled, admin flag, renamed, sessions ended by a password
 * change or reset) drops the account; a membership change (role changed, removed, added) drops that
 * membership; a sign-out drops the session from the session cache. So the next request after the
 * change reads MariaDB again — on this instance at once, and on others as soon as the change reaches
 * them (AccessChanges is the seam a cross-instance relay implements). `ttlMs` bounds what a change
 * that reached no listener could leave behind.
 *
 * Only memberships of existing projects are kept (an unknown project id is not remembered as
 * invisible: it may be created next).
 */
export interface CachedAccount {
  user: Express.User;
  disabled: boolean;
}

export interface AccessCacheOptions {
  ttlMs: number;
  max: number;
}

export const DEFAULT_ACCESS_CACHE: AccessCacheOptions = { ttlMs: 60_000, max: 10_000 };

export class AccessCache {
  readonly accounts: TtlCache<number, CachedAccount | null>;
  readonly memberships: TtlCache<string, { exists: boolean; role: ProjectRole | null }>;
  private readonly unsubscribe: () => void;

  constructor(changes: AccessChanges, options: AccessCacheOptions = DEFAULT_ACCESS_CACHE, onSignedOut: (sessionId: string) => void = () => undefined) {
    this.accounts = new TtlCache(options.ttlMs, options.max);
    this.memberships = new TtlCache(options.ttlMs, options.max);
    this.unsubscribe = changes.subscribe((change) => {
      if (change.kind === 'account') this.accounts.delete(change.userId);
      else if (change.kind === 'membership') this.memberships.delete(membershipKey(change.projectId, change.userId));
      else if (change.kind === 'signed_out') onSignedOut(change.sessionId);
    });
  }

  /** The account, from the cache or `load` (null: no such account). */
  account(userId: number, load: () => Promise<CachedAccount | null>): Promise<CachedAccount | null> {
    return this.accounts.through(userId, load);
  }

  role(projectId: number, userId: number, load: () => Promise<{ exists: boolean; role: ProjectRole | null }>) {
    return this.memberships.through(membershipKey(projectId, userId), load, (r) => r.exists);
  }

  close(): void {
    this.unsubscribe();
    this.accounts.clear();
    this.memberships.clear();
  }
}

const membershipKey = (projectId: number, userId: number) => `${projectId}:${userId}`;
