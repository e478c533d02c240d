/**
 * A small in-process cache for per-request lookups that change rarely (sessions, accounts,
 * memberships): bounded (the oldest-used entry goes first), every entry expires after `ttlMs` even if
 * no invalidation reached it, and a load that was in flight while anything was invalidated is not
 * stored — otherwise a read that started before a demotion could put the old role back after the
 * demotion's invalidation and keep it for the whole TTL.
 */
export class TtlCache<K, V> {
  private readonly entries = new Map<K, { value: V; at: number }>();
  /** Bumped by every invalidation; a load stores its result only if it is unchanged. */
  private generation = 0;

  constructor(
    private readonly ttlMs: number,
    private readonly max: number,
    private readonly now: () => number = Date.now,
  ) {}

  get(key: K): V | undefined {
    const hit = this.entries.get(key);
    if (!hit) return undefined;
    if (this.now() - hit.at >= this.ttlMs) {
      this.entries.delete(key);
      return undefined;
    }
    // Most recently used last, so eviction takes the first.
    this.entries.delete(key);
    this.entries.set(key, hit);
    return hit.value;
  }

  set(key: K, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, { value, at: this.now() });
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value as K);
  }

  /** The cached value, or `load()`'s, stored unless an invalidation happened meanwhile (or `keep` says no). */
  async through(key: K, load: () => Promise<V>, keep: (value: V) => boolean = () => true): Promise<V> {
    const hit = this.get(key);
    if (hit !== undefined) return hit;
    const mark = this.mark();
    const value = await load();
    if (keep(value)) this.setIfUnchanged(key, value, mark);
    return value;
  }

  /** Taken before a load: `setIfUnchanged` stores its result only if nothing was invalidated since. */
  mark(): number {
    return this.generation;
  }

  setIfUnchanged(key: K, value: V, mark: number): void {
    if (mark === this.generation) this.set(key, value);
  }

  delete(key: K): void {
    this.generation++;
    this.entries.delete(key);
  }

  /** Drops every entry `match` selects. */
  deleteWhere(match: (key: K) => boolean): void {
    this.generation++;
    for (const key of [...this.entries.keys()]) if (match(key)) this.entries.delete(key);
  }

  clear(): void {
    this.generation++;
    this.entries.clear();
  }

  get size(): number {
    return this.entries.size;
  }
}
