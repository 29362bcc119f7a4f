// Paged segment lists are read far more often than segments change: answers
// are kept per agency and query, and every write to an agency's segments or
// surveys bumps its generation so no stale page is ever served.
//
// Bounded by bytes, not entries: a thousand 1,000-row pages of long notes pinned
// hundreds of MB. The oldest entries go first when the budget is reached, and one
// answer larger than a tenth of the budget is never kept.
export const DEFAULT_LIST_CACHE_BYTES = 64 * 1024 * 1024;

export class ListCache {
  private generation = new Map<string, number>();
  private entries = new Map<string, string>();
  private used = 0;

  constructor(private readonly maxBytes = DEFAULT_LIST_CACHE_BYTES) {}

  /** Bytes held now (JSON text is UTF-16 in memory: two bytes a character). */
  get bytes() {
    return this.used;
  }

  get size() {
    return this.entries.size;
  }

  key(agencyId: string, query: unknown) {
    return `${agencyId}|${this.generation.get(agencyId) ?? 0}|${JSON.stringify(query)}`;
  }

  get(key: string) {
    const hit = this.entries.get(key);
    if (hit !== undefined) {
      // Most recently used last: eviction takes from the front.
      this.entries.delete(key);
      this.entries.set(key, hit);
    }
    return hit;
  }

  set(key: string, json: string) {
    const cost = (key.length + json.length) * 2;
    if (cost > this.maxBytes / 10) return;
    this.remove(key);
    while (this.used + cost > this.maxBytes && this.entries.size) this.remove(this.entries.keys().next().value!);
    this.entries.set(key, json);
    this.used += cost;
  }

  /** Call after any change to the agency's segments or surveys. */
  bump(agencyId: string) {
    this.generation.set(agencyId, (this.generation.get(agencyId) ?? 0) + 1);
    for (const k of [...this.entries.keys()]) if (k.startsWith(`${agencyId}|`)) this.remove(k);
  }

  private remove(key: string) {
    const v = this.entries.get(key);
    if (v === undefined) return;
    this.used -= (key.length + v.length) * 2;
    this.entries.delete(key);
  }
}
