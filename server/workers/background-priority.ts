import { readlinkSync } from 'node:fs';
import { setPriority } from 'node:os';

/**
 * Puts the calling worker thread at the lowest CPU priority (nice 19), leaving the rest of the
 * process as it is: on Linux a nice value belongs to one thread, and /proc/thread-self names it.
 * For background work nobody waits on (conformers), so that sockets, requests and evaluations — and
 * a browser on the same machine — come first. Elsewhere, or when not allowed, it changes nothing.
 * A thread started later by the main thread starts at the main thread's priority again.
 */
export function lowerThreadPriority(): void {
  try {
    const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
    if (Number.isInteger(tid) && tid > 0) setPriority(tid, 19);
  } catch {
    // Not Linux, or not permitted: stay at normal priority.
  }
}
