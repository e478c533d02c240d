import type { AccessChanges } from './access-changes';
import type { InvalidationBus } from '../cluster/invalidation-bus';
import type { ProjectRole } from '../../src/shared/roles';
import { TtlCache } from '../cache/ttl-cache';

/**
 * What every signed-in request used to read from MariaDB before its own work: the account behind
 * the session (passport.ts) and the caller's role in the project it touches (access.ts). Both are
 * kept here and dropped by the access changes the services already publish after committing
 * (access-changes.ts): an account change (disabled, admin flag, renamed, sessions ended by a password
 * change or reset) drops the account; a membership change (role changed, removed, added) drops that
 * membership; a sign-out drops the session from the session cache; a 'resync' (this instance may
 * have missed changes while its link to the others was down) drops everything. So the next request after the
 * change reads MariaDB again — on this instance at once, and on others as soon as the change reaches
 * them (AccessChanges is the seam a cross-instance relay implements). `ttlMs` bounds what a change
 * that reached no listener could leave behind.
 *
 * The project a mapping or molecule belongs to is kept too (it never changes; a deletion is published
 * on ctx.invalidation, PROJECT_OF_TOPIC). Only memberships of existing projects are kept (an unknown project id is not remembered as
 * invisible: it may be created next).
 */
export interface CachedAccount {
  user: Express.User;
  disabled: boolean;
}

/** The session rows an instance keeps (session-cache.ts). */
export interface SessionForgetting {
  forget(sessionId: string): void;
  forgetAll(): void;
}

export interface AccessCacheOptions {
  ttlMs: number;
  max: number;
}

export const DEFAULT_ACCESS_CACHE: AccessCacheOptions = { ttlMs: 60_000, max: 10_000 };

export class AccessCache {
  readonly accounts: TtlCache<number, CachedAccount | null>;
  readonly memberships: TtlCache<string, { exists: boolean; role: ProjectRole | null }>;
  /** The project a mapping or molecule belongs to ('mapping:12' → 3): fixed for its life, gone when it is deleted. */
  readonly projects: TtlCache<string, number>;
  private readonly unsubscribe: () => void;
  private readonly unsubscribeDeleted: () => void;

  constructor(changes: AccessChanges, sessions: SessionForgetting, invalidation: InvalidationBus, options: AccessCacheOptions = DEFAULT_ACCESS_CACHE) {
    this.accounts = new TtlCache(options.ttlMs, options.max);
    this.memberships = new TtlCache(options.ttlMs, options.max);
    this.projects = new TtlCache(options.ttlMs, options.max);
    // A deleted molecule takes its mappings with it, whose ids this instance cannot list: drop them all (rare).
    this.unsubscribeDeleted = invalidation.subscribe(PROJECT_OF_TOPIC, () => this.projects.clear());
    this.unsubscribe = changes.subscribe((change) => {
      if (change.kind === 'account') this.accounts.delete(change.userId);
      else if (change.kind === 'membership') this.memberships.delete(membershipKey(change.projectId, change.userId));
      else if (change.kind === 'signed_out') sessions.forget(change.sessionId);
      else if (change.kind === 'resync') {
        // This instance may have missed changes (its Redis subscription was interrupted): keep nothing.
        this.accounts.clear();
        this.memberships.clear();
        this.projects.clear();
        sessions.forgetAll();
      }
    });
  }

  /** The account, from the cache or `load` (null: no such account). */
  account(userId: number, load: () => Promise<CachedAccount | null>): Promise<CachedAccount | null> {
    return this.accounts.through(userId, load);
  }

  role(projectId: number, userId: number, load: () => Promise<{ exists: boolean; role: ProjectRole | null }>) {
    return this.memberships.through(membershipKey(projectId, userId), load, (r) => r.exists);
  }

  /** The project of a mapping or molecule (null: there is no such thing, not kept). */
  projectOf(kind: 'mapping' | 'molecule', id: number, load: () => Promise<number | null>): Promise<number | null> {
    return this.projects.through(`${kind}:${id}`, load as () => Promise<number>, (projectId) => projectId !== null);
  }

  close(): void {
    this.unsubscribe();
    this.unsubscribeDeleted();
    this.projects.clear();
    this.accounts.clear();
    this.memberships.clear();
  }
}

/** Published (ctx.invalidation) with the deleted thing's key, e.g. 'molecule:7', when a molecule or mapping is deleted. */
export const PROJECT_OF_TOPIC = 'project-of';

const membershipKey = (projectId: number, userId: number) => `${projectId}:${userId}`;
