/**
 * Changes of who may do what, for the holders of long-lived access: an open collaboration socket was
 * authorised once, at its upgrade, so the services that change a membership, an account, a mapping's
 * lock or a session publish the change here, and the collab server re-decides every affected
 * connection with the permission module (server/drafts/collab-access.ts).
 *
 * Publish after the change is committed: a listener re-reads MariaDB and must see it. Listeners run
 * synchronously and must not throw (they start their own async work).
 *
 * In-process here; with REDIS_URL, redis-access-changes.ts carries the same events to every app
 * server: it publishes locally and to the channel, and feeds what arrives from the channel to its
 * local listeners. The events are plain JSON for that.
 */
export type AccessChange =
  /** A member's role changed, or they were removed from the project. */
  | { kind: 'membership'; projectId: number; userId: number }
  /** An account was disabled, gained or lost the admin flag, was renamed, or had all its sessions ended. */
  | { kind: 'account'; userId: number }
  /** A mapping was locked for production or unlocked. */
  | { kind: 'lock'; mappingId: number }
  /** One session signed out. */
  | { kind: 'signed_out'; sessionId: string }
  /**
   * This instance may have missed changes (its Redis subscription was interrupted, redis-access-changes.ts):
   * every open connection and room decides again. Never sent to other instances.
   */
  | { kind: 'resync' };

export type AccessListener = (change: AccessChange) => void;

export interface AccessChanges {
  publish(change: AccessChange): void;
  /** Returns the unsubscribe function. */
  subscribe(listener: AccessListener): () => void;
}

/** The single-process hub. */
export function createLocalAccessChanges(onListenerError: (err: unknown) => void = () => undefined): AccessChanges {
  const listeners = new Set<AccessListener>();
  return {
    publish(change) {
      for (const listener of listeners) {
        try {
          listener(change);
        } catch (err) {
          onListenerError(err);
        }
      }
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => void listeners.delete(listener);
    },
  };
}
